// The embeddable strip (for an iframe on a museum's site). Links open the exhibit in a new tab.
import type { EmbedView } from "../../lib/visit/embed-view";
import { Strip } from "./strip";

export function EmbedPage({ view }: { view: EmbedView }) {
  const { t } = view.page;
  return (
    <main className="p-3">
      <h1 className="m-0 text-xl font-bold">{view.title}</h1>
      <p className="my-1">{view.statement}</p>
      <Strip model={view.strip} caption={view.caption} />
      <details className="mt-2">
        <summary className="visit-switch">{t.markersHeading}</summary>
        <ol className="pl-6">
          {view.rows.map((r) => (
            <li key={r.signNumber} value={r.signNumber}>
              <a href={r.href} target="_blank" rel="noopener">
                {r.label}
              </a>{" "}
              — {r.ageText}, {r.distance}
            </li>
          ))}
        </ol>
      </details>
      <p className="m-0 mt-2">
        <a href={view.exhibitHref} target="_blank" rel="noopener" className="inline-flex min-h-11 items-center font-semibold">
          {t.embedOpen}
        </a>
      </p>
    </main>
  );
}
