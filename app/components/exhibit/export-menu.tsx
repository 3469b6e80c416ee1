// The exhibit page's export menu: the files made from a publication snapshot (server/exports/
// registry.server.ts), each offered from the latest publication (what the reviewer checked) and
// from the working copy (every such file says "DRAFT — not checked"). Plain links in a disclosure:
// it works before the page's script has loaded. The schedule CSV stays a button of its own.
// Print panels may be made in the background: their links show the job's progress (export-progress).
import { ExportJobs, startBackgroundExport } from "./export-progress";

export interface ExportMenuView {
  /** The exhibit's latest publication number, null while it has none. */
  publication: number | null;
  /** The organisation's slug, for the public address of a publication's files. */
  organisation: string;
  files: { name: string; title: string; purpose: string }[];
}

export function ExportMenu({ slug, view }: { slug: string; view: ExportMenuView }) {
  if (view.files.length === 0) return null;
  const href = (name: string, from: "publication" | "draft") => `/studio/exhibits/${encodeURIComponent(slug)}/${name}?from=${from}`;
  return (
    <details className="relative font-sans text-sm" data-testid="export-menu">
      <summary className="btn-quiet cursor-pointer list-none no-underline">Export files ▾</summary>
      {/* On phones in the page's flow (never off the screen); wider screens float it over the page, above the sticky preview. */}
      <div className="mt-2 w-[min(28rem,calc(100vw-2rem))] rounded border border-rule bg-paper p-4 text-left shadow-sm sm:absolute sm:left-0 sm:z-30 sm:shadow-lg">
        <p className="text-ink-soft">
          {view.publication
            ? `From publication ${view.publication}: as the reviewer checked it. From the working copy: every file says “DRAFT — not checked”.`
            : "Not published yet: files come from the working copy and say “DRAFT — not checked”."}
        </p>
        <ul className="mt-3 space-y-3">
          {view.files.map((f) => (
            <li key={f.name}>
              <span className="font-semibold text-ink">{f.title}</span>
              <p className="text-ink-soft">{f.purpose}</p>
              <p className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
                {view.publication ? (
                  <a href={href(f.name, "publication")} download aria-label={`${f.title} from publication ${view.publication}`} onClick={f.name === "panels.pdf" ? startBackgroundExport : undefined}>
                    Publication {view.publication}
                  </a>
                ) : null}
                <a href={href(f.name, "draft")} download aria-label={`${f.title} from the working copy (draft)`} onClick={f.name === "panels.pdf" ? startBackgroundExport : undefined}>
                  Working copy (draft)
                </a>
              </p>
            </li>
          ))}
        </ul>
        <ExportJobs />
        {view.publication ? (
          <p className="mt-3 text-ink-soft">
            Anyone can fetch a publication’s files without signing in, e.g. <code className="break-all">/api/exhibits/{view.organisation}/{slug}/publications/{view.publication}/{view.files[0].name}</code>
          </p>
        ) : null}
      </div>
    </details>
  );
}
