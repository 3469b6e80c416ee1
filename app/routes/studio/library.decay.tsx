// /studio/library/decay — the decay systems behind "how we know" panels: parent → daughter,
// half-life ±, decay constant and source. Read-only reference data for every member; the
// calculator runs the pure decay code in the browser.
import { useMemo, useState } from "react";
import { Link } from "react-router";
import { checkedSentence, checksFigures } from "~/components/dated-events/checking";
import { formatScientific, howWeKnow, decayFigures } from "~/lib/decay";
import { DECIMAL_PATTERN, formatExactYears, toMa } from "~/lib/dated-events";
import { AGE_UNITS, type AgeUnit } from "~/lib/units";
import { requireMember } from "#server/auth.server.ts";
import { listDecaySystems } from "#server/dated-events.server.ts";
import type { Route } from "./+types/library.decay";

export const meta: Route.MetaFunction = () => [{ title: "Decay systems · Event library · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  // Editors, reviewers and admins check figures: they read how far each half-life was checked.
  const checker = checksFigures(member.roles);
  const systems = await listDecaySystems();
  return { systems: systems.map((s) => ({ ...s, checked: checker ? checkedSentence(s.verification, s.checkedAgainst, true) : null })) };
}

/** "U-238" → "²³⁸U" for display. */
function isotope(label: string) {
  const m = label.match(/^([A-Z][a-z]?)-(\d+)$/);
  if (!m) return label;
  const sup: Record<string, string> = { "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };
  return `${m[2].split("").map((d) => sup[d]).join("")}${m[1]}`;
}

export default function DecaySystems({ loaderData }: Route.ComponentProps) {
  const { systems } = loaderData;
  const [age, setAge] = useState("66.043");
  const [unit, setUnit] = useState<AgeUnit>("Ma");
  const ageYears = useMemo(() => {
    const v = age.trim();
    if (!DECIMAL_PATTERN.test(v)) return null;
    return Number(toMa(v, unit)) * 1e6;
  }, [age, unit]);
  return (
    <div>
      <p className="font-sans text-sm"><Link to="/studio/library">← Event library</Link></p>
      <h1 className="mt-2 text-3xl">Decay systems</h1>
      <p className="mt-2 max-w-3xl text-ink-soft">
        The radioactive clocks behind the ages in the library. A parent isotope decays to its daughter at a fixed rate: after one half-life half of it is left, after two a quarter.
        Measuring how much daughter has grown per parent atom left gives the age, t = ln(1 + D/P) / λ. Where a source or the 1977 IUGS convention fixes the decay constant λ, the half-life shown is ln 2 / λ.
      </p>

      <section className="card mt-6" aria-labelledby="calc">
        <h2 id="calc" className="text-xl">How much is left?</h2>
        <div className="mt-3 flex flex-wrap items-end gap-3">
          <div>
            <label htmlFor="calc-age" className="mb-1 block text-sm font-semibold">Age</label>
            <input id="calc-age" inputMode="decimal" value={age} onChange={(e) => setAge(e.target.value)} className="field w-40 figures" aria-invalid={ageYears === null ? true : undefined} aria-describedby="calc-help" />
          </div>
          <div>
            <label htmlFor="calc-unit" className="mb-1 block text-sm font-semibold">Unit</label>
            <select id="calc-unit" value={unit} onChange={(e) => setUnit(e.target.value as AgeUnit)} className="field w-auto">
              {AGE_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
            </select>
          </div>
          <p id="calc-help" className="pb-2 font-sans text-sm text-ink-soft">
            {ageYears === null ? "Write the age as a plain number, e.g. 4404 or 0.315." : "The “Left after” column below follows this age."}
          </p>
        </div>
      </section>

      <div className="card mt-6 overflow-x-auto p-0">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Decay systems with half-lives, decay constants and sources</caption>
          <thead className="border-b border-rule bg-paper">
            <tr>
              <th scope="col" className="p-3">Parent → daughter</th>
              <th scope="col" className="p-3 text-right">Half-life</th>
              <th scope="col" className="p-3 text-right">Decay constant λ</th>
              <th scope="col" className="p-3 text-right">Left after {age.trim() || "…"} {unit}</th>
              <th scope="col" className="p-3">Source and notes</th>
            </tr>
          </thead>
          <tbody>
            {systems.map((s) => {
              const left =
                ageYears === null
                  ? null
                  : howWeKnow(ageYears, decayFigures(s));
              return (
                <tr key={s.slug} className="border-b border-rule align-top last:border-0">
                  <th scope="row" className="p-3 text-left">
                    <span className="text-base">{isotope(s.parent)} → {isotope(s.daughter)}</span>
                    <div className="mt-1 max-w-56 font-normal text-ink-soft">{s.decayMode}</div>
                  </th>
                  <td className="whitespace-nowrap p-3 text-right figures">{formatExactYears(s.halfLifeYears, s.halfLifeUncertaintyYears)}</td>
                  <td className="whitespace-nowrap p-3 text-right figures">
                    {formatScientific(Number(s.decayConstantPerYear))} a⁻¹
                    <div className="text-xs text-ink-soft">{s.decayConstantStated ? "as stated by the source" : "ln 2 / half-life"}</div>
                    {s.branchConstantPerYear ? <div className="text-xs text-ink-soft">λₑ (to {isotope(s.daughter)}) {formatScientific(Number(s.branchConstantPerYear))} a⁻¹</div> : null}
                  </td>
                  <td className="whitespace-nowrap p-3 text-right figures">
                    {left ? (
                      <>
                        <span className="font-semibold">{left.percentText}</span>
                        <div className="text-xs text-ink-soft">{Number(left.halfLives.toPrecision(3))} half-lives</div>
                      </>
                    ) : "—"}
                  </td>
                  <td className="max-w-md p-3">
                    <p className="font-serif">{s.citation}{s.doi ? <> <a href={`https://doi.org/${s.doi}`} rel="noreferrer">doi:{s.doi}</a></> : null}</p>
                    {s.checked ? <p className="mt-1 font-sans text-xs">{s.checked}</p> : null}
                    {s.notes ? <p className="mt-1 text-ink-soft">{s.notes}</p> : null}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="mt-3 font-sans text-xs text-ink-soft">
        The percentages assume a closed system that held no daughter at the start — the textbook case. Real ages come from measured ratios, isochrons and concordia, with corrections the source describes.
      </p>
    </div>
  );
}
