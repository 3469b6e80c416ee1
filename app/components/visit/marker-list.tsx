// The markers in order: sign number, name (a link to the marker page), age, distance from the start
// with its ±, walking time. This list is also the scale strip's text alternative.
import type { MarkerRow } from "../../lib/visit/view";
import { textOn } from "../../lib/chart/colour";
import type { Messages } from "../../lib/visit/messages";

export function MarkerList({ rows, t }: { rows: MarkerRow[]; t: Messages }) {
  return (
    <ol className="m-0 list-none p-0">
      {rows.map((r) => (
        <li key={r.signNumber} className="flex gap-3 border-b border-[#d5cdbd] py-2">
          <span className="visit-chip shrink-0" style={{ background: r.color, color: textOn(r.color) }} aria-hidden="true">
            {r.signNumber}
          </span>
          <div className="min-w-0">
            <a href={r.href} className="inline-block min-h-6 font-semibold">
              <span className="sr-only">{t.colSign} {r.signNumber}: </span>
              {r.label}
            </a>
            <p className="m-0 text-[0.95rem]">
              <span className="sr-only">{t.colAge}: </span>
              {r.ageText} · <span className="sr-only">{t.colDistance}: </span>
              {r.distance}
              {r.uncertainty ? ` ${r.uncertainty}` : ""}
              {r.walk ? (
                <>
                  {" "}
                  · <span className="sr-only">{t.colWalk}: </span>
                  {r.walk}
                </>
              ) : null}
            </p>
          </div>
        </li>
      ))}
    </ol>
  );
}
