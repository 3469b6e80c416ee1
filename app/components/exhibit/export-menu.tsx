// The exhibit page's export menu: the files made from a publication snapshot (server/exports/
// registry.server.ts), offered from the latest publication (what the reviewer checked; the default)
// or from the working copy (every file then says "DRAFT — not checked"). The schedule CSV stays a
// button of its own beside it.
import { useId, useState } from "react";

export interface ExportMenuView {
  /** The exhibit's latest publication number, null while it has none. */
  publication: number | null;
  /** The organisation's slug, for the public address of a publication's files. */
  organisation: string;
  files: { name: string; title: string; purpose: string }[];
}

export function ExportMenu({ slug, view }: { slug: string; view: ExportMenuView }) {
  const [from, setFrom] = useState<"publication" | "draft">(view.publication ? "publication" : "draft");
  const id = useId();
  if (view.files.length === 0) return null;
  const href = (name: string) => `/studio/exhibits/${encodeURIComponent(slug)}/${name}?from=${from}`;
  return (
    <details className="relative font-sans text-sm" data-testid="export-menu">
      <summary className="btn-quiet cursor-pointer list-none no-underline">Export files ▾</summary>
      <div className="absolute right-0 z-20 mt-2 w-[min(26rem,calc(100vw-2rem))] rounded border border-rule bg-paper p-4 text-left shadow-lg">
        <fieldset>
          <legend className="font-semibold">Made from</legend>
          <label className="mt-2 flex items-start gap-2">
            <input type="radio" name={`${id}-from`} value="publication" checked={from === "publication"} disabled={!view.publication} onChange={() => setFrom("publication")} />
            <span>{view.publication ? `Publication ${view.publication}: as the reviewer checked it` : "A publication (none yet)"}</span>
          </label>
          <label className="mt-1 flex items-start gap-2">
            <input type="radio" name={`${id}-from`} value="draft" checked={from === "draft"} onChange={() => setFrom("draft")} />
            <span>The working copy: every file says “DRAFT — not checked”</span>
          </label>
        </fieldset>
        <ul className="mt-3 space-y-2">
          {view.files.map((f) => (
            <li key={f.name}>
              <a href={href(f.name)} download className="font-semibold">
                {f.title}
              </a>
              <p className="text-ink-soft">{f.purpose}</p>
            </li>
          ))}
        </ul>
        {view.publication && from === "publication" ? (
          <p className="mt-3 text-ink-soft">
            Anyone can fetch a publication’s files without signing in, e.g. <code className="break-all">/api/exhibits/{view.organisation}/{slug}/publications/{view.publication}/{view.files[0].name}</code>
          </p>
        ) : null}
      </div>
    </details>
  );
}
