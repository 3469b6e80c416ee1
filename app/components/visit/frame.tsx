// The frame of every visitor page: skip link, organisation and title, the language switcher (plain
// links with ?lang=, no script needed), the offline note that public/visit.js fills in, and the
// footer with the review and publication lines.
import type { PageBasics } from "../../lib/visit/view";
import { fill } from "../../lib/visit/messages";

export function LanguageSwitcher({ page }: { page: PageBasics }) {
  const current = page.languages.find((l) => l.current);
  return (
    <details className="mt-2">
      <summary className="visit-switch">
        {page.t.languageLabel}: <span lang={current?.tag}>&nbsp;{current?.name ?? page.lang}</span>
      </summary>
      <ul className="m-0 flex list-none flex-wrap gap-x-1 gap-y-1 p-0 pt-1">
        {page.languages.map((l) => (
          <li key={l.tag}>
            <a href={l.href} lang={l.tag} hrefLang={l.tag} aria-current={l.current ? "true" : undefined} className="inline-flex min-h-11 items-center px-2">
              {l.name}
            </a>
          </li>
        ))}
      </ul>
      {page.lang !== "en" ? <p className="text-sm">{fill(page.t.intervalNamesNote, { language: current?.name ?? page.lang })}</p> : null}
    </details>
  );
}

/** `precache`: the pages public/visit.js asks the service worker to keep for use without signal. */
export function VisitFrame({ page, kicker, heading, skipTo, children, precache }: { page: PageBasics; kicker: React.ReactNode; heading: string; skipTo: string; children: React.ReactNode; precache: string[] }) {
  const { t } = page;
  return (
    <div
      className="mx-auto max-w-3xl px-4 pb-10"
      data-visit-org={page.org}
      data-visit-slug={page.slug}
      data-visit-version={page.publication.sha256}
      data-precache={JSON.stringify(precache)}
      data-lang={page.htmlLang}
      data-t-saving={t.offlineSaving}
      data-t-saved={t.offlineSaved}
      data-t-failed={t.offlineFailed}
      data-t-showing={t.offlineShowing}
    >
      <a className="visit-skip" href={`#${skipTo}`}>
        {skipTo === "markers" ? t.skipToMarkers : t.skipToContent}
      </a>
      <header className="border-b border-[#d5cdbd] pb-3 pt-4">
        <p className="m-0 text-sm text-[#4a5160]">{kicker}</p>
        <h1 className="m-0 mt-1 text-3xl font-bold leading-tight">{heading}</h1>
        <LanguageSwitcher page={page} />
      </header>
      <p id="visit-offline" role="status" className="my-3 rounded border-2 border-[#8a5a00] bg-[#fbf3e9] p-3" hidden />
      <main>{children}</main>
      <footer className="mt-8 border-t border-[#d5cdbd] pt-3 text-sm">
        <p className="m-0">{page.checkedLine}</p>
        <p className="m-0">{page.publicationLine}</p>
      </footer>
      <script src="/visit.js" defer />
    </div>
  );
}
