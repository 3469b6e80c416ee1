// The scale strip: rows of interval bands in the standard chart colours, each labelled (black or
// white text, ≥ 4.5:1) where there is room, each at its own place (a rank may begin later than
// the span: the Hadean has no eras), and a tick for each marker. Decorative for assistive
// technology: the figure's caption and the marker list say the same in words.
import type { StripModel } from "../../lib/visit/strip";

function pct(x: number): string {
  return `${(x * 100).toFixed(3)}%`;
}

export function Strip({ model, caption, here }: { model: StripModel; caption: string; here?: number }) {
  return (
    <figure className="m-0">
      <div aria-hidden="true" className="border border-[#1f2430]">
        {model.rows.map((row) => (
          <div key={row.rank} className="visit-strip-row">
            {row.bands.map((b) => (
              <div
                key={`${b.start}-${b.name}`}
                className="visit-band"
                title={b.name}
                lang={b.lang ?? undefined}
                style={{ left: pct(b.start), width: pct(b.width), background: b.color, color: b.textColor }}
              >
                {b.labelled ? b.name : ""}
              </div>
            ))}
          </div>
        ))}
      </div>
      <div aria-hidden="true" className="visit-ticks">
        {model.ticks.map((t) => (
          <span key={t.signNumber} className={t.signNumber === here ? "visit-tick here" : "visit-tick"} style={{ left: pct(t.at) }} />
        ))}
      </div>
      <figcaption className="text-sm text-[#4a5160]">{caption}</figcaption>
    </figure>
  );
}
