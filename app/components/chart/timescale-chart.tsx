// The chart of one edition: a column per rank (eon … age) on a vertical time axis, youngest at the
// top, each interval a box in its standard chart colour with its name. An interval whose next rank
// down is missing (the Hadean, the Precambrian periods, the Pridoli, ranks that are hidden) widens
// to the right until its own subdivisions begin. The reader chooses the stretch of time to draw
// (typed as two ages, or taken from an interval), which levels to show, and how tall the boxes
// are: equal (every name readable) or by duration (time as distance, as on an exhibit). Choosing a
// box opens a card about that interval, from which its own time can be drawn.
import { AxisLeft } from "@visx/axis";
import { Group } from "@visx/group";
import { scaleLinear } from "d3-scale";
import { useId, useMemo, useState } from "react";
import { RANKS, rankDepth, type Interval, type Rank } from "~/lib/timescale";
import { round9 } from "~/lib/timescale/numbers";
import { INK, textOn } from "~/lib/chart/colour";
import { RANK_LABELS, fmtBase, fmtMa } from "~/lib/chart/format";

const COLUMN_WIDTH: Record<Rank, number> = { eon: 96, era: 122, period: 116, subperiod: 120, epoch: 136, age: 140 };
const HEADER = 30;
const ROW = 19;
const SCALE_HEIGHT = 960;
const AGE_COLUMN = 118;
const AXIS = 56;
const CHAR_WIDTH = 6.5;
const LABEL_REPEAT = 480;

export type Spacing = "even" | "scale";

interface Box {
  iv: Interval;
  x: number;
  width: number;
  y: number;
  height: number;
}

/** The stretch of time drawn, in Ma (older > younger). */
interface TimeWindow {
  older: number;
  younger: number;
}

/** Centred in a short box; near the top of a tall one, repeated down a very tall one so it stays in view. */
function labelPositions(y: number, height: number): number[] {
  if (height <= 48) return [y + height / 2];
  const out = [y + 13];
  for (let at = y + 13 + LABEL_REPEAT; at < y + height - 20; at += LABEL_REPEAT) out.push(at);
  return out;
}

function fitLabel(name: string, width: number): string | null {
  const max = Math.floor((width - 10) / CHAR_WIDTH);
  if (name.length <= max) return name;
  return max >= 4 ? `${name.slice(0, max - 1)}…` : null;
}

export function TimescaleChart({
  intervals,
  title,
  initialSpacing = "even",
}: {
  intervals: readonly Interval[];
  title: string;
  initialSpacing?: Spacing;
}) {
  const id = useId();
  const [hidden, setHidden] = useState<ReadonlySet<Rank>>(new Set());
  const [win, setWin] = useState<TimeWindow | null>(null);
  const [selected, setSelected] = useState<string | null>(null);
  const [spacing, setSpacing] = useState<Spacing>(initialSpacing);
  const [typed, setTyped] = useState({ older: "", younger: "" });
  const [typedError, setTypedError] = useState<string | null>(null);

  const model = useMemo(() => {
    const byName = new Map(intervals.map((iv) => [iv.name, iv] as const));
    const children = new Map<string, Interval[]>();
    for (const iv of intervals) {
      if (iv.parent === null) continue;
      const list = children.get(iv.parent);
      if (list) list.push(iv);
      else children.set(iv.parent, [iv]);
    }
    // Ranks found below each interval.
    const below = new Map<string, Set<Rank>>();
    const walk = (iv: Interval): Set<Rank> => {
      const known = below.get(iv.name);
      if (known) return known;
      const set = new Set<Rank>();
      below.set(iv.name, set);
      for (const c of children.get(iv.name) ?? []) {
        set.add(c.rank);
        for (const r of walk(c)) set.add(r);
      }
      return set;
    };
    intervals.forEach(walk);
    const present = RANKS.filter((r) => intervals.some((iv) => iv.rank === r));
    return { byName, children, below, present };
  }, [intervals]);

  const chosen = selected ? model.byName.get(selected) ?? null : null;
  const visible = model.present.filter((r) => !hidden.has(r));
  const visibleKey = visible.join(",");

  const layout = useMemo(() => {
    const all = intervals.filter((iv) => Number.isFinite(iv.baseMa) && Number.isFinite(iv.topMa));
    const windowBase = win ? win.older : Math.max(...all.map((iv) => iv.baseMa));
    const windowTop = win ? win.younger : Math.min(...all.map((iv) => iv.topMa));
    const inWindow = all.filter((iv) => visible.includes(iv.rank) && iv.baseMa > windowTop && iv.topMa < windowBase);
    // Only columns with something in this span (the sub-period column exists only in the Carboniferous).
    const columns = visible.filter((r) => inWindow.some((iv) => iv.rank === r));
    const shown = inWindow;
    const columnX: number[] = [];
    let x = 0;
    for (const r of columns) {
      columnX.push(x);
      x += COLUMN_WIDTH[r];
    }
    const columnsWidth = x;

    const ages = new Set<number>([round9(windowBase), round9(windowTop)]);
    for (const iv of shown) {
      if (iv.baseMa < windowBase) ages.add(round9(iv.baseMa));
      if (iv.topMa > windowTop) ages.add(round9(iv.topMa));
    }
    const boundaries = [...ages].sort((a, b) => a - b);
    const height = spacing === "even" ? Math.max(ROW * 8, (boundaries.length - 1) * ROW) : SCALE_HEIGHT;
    const y =
      spacing === "even"
        ? scaleLinear<number>().domain(boundaries).range(boundaries.map((_, i) => i * ROW))
        : scaleLinear<number>().domain([windowTop, windowBase]).range([0, SCALE_HEIGHT]);

    const boxes: Box[] = shown.map((iv) => {
      const start = columns.indexOf(iv.rank);
      const deeper = [...(model.below.get(iv.name) ?? [])].map((r) => columns.indexOf(r)).filter((i) => i > start);
      const end = deeper.length ? Math.min(...deeper) - 1 : columns.length - 1;
      const top = y(Math.max(iv.topMa, windowTop));
      const bottom = y(Math.min(iv.baseMa, windowBase));
      return {
        iv,
        x: columnX[start],
        width: columnX[end] + COLUMN_WIDTH[columns[end]] - columnX[start],
        y: top,
        height: Math.max(0.5, bottom - top),
      };
    });
    boxes.sort((a, b) => rankDepth(a.iv.rank) - rankDepth(b.iv.rank));

    // Base ages in the right-hand column, where there is room for them.
    const baseAt = new Map<number, Interval>();
    for (const iv of all) if (!baseAt.has(round9(iv.baseMa))) baseAt.set(round9(iv.baseMa), iv);
    const ageLabels: { y: number; text: string }[] = [];
    let last = -Infinity;
    for (const a of boundaries) {
      const yy = y(a);
      if (yy - last < 13 && a !== boundaries[boundaries.length - 1]) continue;
      if (yy - last < 13) ageLabels.pop();
      const iv = baseAt.get(a);
      ageLabels.push({ y: yy, text: a === 0 ? "0" : iv ? fmtBase(iv) : fmtMa(a) });
      last = yy;
    }
    return { boxes, columns, columnX, columnsWidth, height, y, ageLabels, windowBase, windowTop };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `visible` is compared by its contents (visibleKey)
  }, [intervals, win, visibleKey, spacing, model]);

  const axis = spacing === "scale" ? AXIS : 0;
  const width = axis + layout.columnsWidth + AGE_COLUMN;
  const svgHeight = HEADER + layout.height + 12;

  const total = { older: Math.max(...intervals.map((iv) => iv.baseMa)), younger: Math.min(...intervals.map((iv) => iv.topMa)) };
  const showTyped = (e: React.FormEvent) => {
    e.preventDefault();
    const older = Number(typed.older);
    const younger = typed.younger.trim() === "" ? 0 : Number(typed.younger);
    if (typed.older.trim() === "" || !Number.isFinite(older) || !Number.isFinite(younger)) return setTypedError("Type both ends as numbers of million years ago, e.g. 252 and 66.");
    if (older <= younger) return setTypedError("The older end must be a larger number of million years ago than the younger end.");
    if (younger < total.younger || older > total.older) return setTypedError(`This chart covers ${fmtMa(total.older)} million years ago to the present; choose ends inside that.`);
    setTypedError(null);
    setWin({ older, younger });
  };
  const showInterval = (iv: Interval) => {
    setWin({ older: iv.baseMa, younger: iv.topMa });
    setTyped({ older: fmtMa(iv.baseMa), younger: fmtMa(iv.topMa) });
    setTypedError(null);
  };

  const toggle = (r: Rank) =>
    setHidden((prev) => {
      const next = new Set(prev);
      if (next.has(r)) next.delete(r);
      else next.add(r);
      return next;
    });

  const spanText = `${fmtMa(layout.windowBase)} to ${layout.windowTop === 0 ? "0 million years ago (the present)" : `${fmtMa(layout.windowTop)} million years ago`}`;
  const perPixel = (layout.windowBase - layout.windowTop) / layout.height;

  return (
    <div>
      <div className="mb-3 flex flex-wrap items-end gap-x-6 gap-y-3 font-sans text-sm">
        <fieldset>
          <legend className="mb-1 font-semibold">Ranks shown</legend>
          <div className="flex flex-wrap gap-1">
            {model.present.map((r) => {
              const on = !hidden.has(r);
              return (
                <button
                  key={r}
                  type="button"
                  aria-pressed={on}
                  disabled={on && visible.length === 1}
                  onClick={() => toggle(r)}
                  className={`min-h-8 rounded border px-2.5 py-1 ${on ? "border-slate-river-700 bg-slate-river-700 text-white" : "border-rule bg-white text-ink-soft line-through"}`}
                >
                  {RANK_LABELS[r]}
                </button>
              );
            })}
          </div>
        </fieldset>
        <fieldset>
          <legend className="mb-1 font-semibold">Box heights</legend>
          <div className="flex flex-wrap gap-x-3">
            {(
              [
                ["even", "Equal — every name readable"],
                ["scale", "By duration — time as distance"],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex min-h-8 items-center gap-1.5">
                <input type="radio" name={`${id}-spacing`} value={value} checked={spacing === value} onChange={() => setSpacing(value)} />
                {label}
              </label>
            ))}
          </div>
        </fieldset>
      </div>
      <form onSubmit={showTyped} className="mb-3 flex flex-wrap items-end gap-2 font-sans text-sm" noValidate>
        <div>
          <label htmlFor={`${id}-older`} className="mb-1 block font-semibold">Draw from (million years ago)</label>
          <input id={`${id}-older`} inputMode="decimal" className="field w-32" value={typed.older} placeholder={fmtMa(total.older)} onChange={(e) => setTyped((t) => ({ ...t, older: e.target.value }))} aria-invalid={typedError ? true : undefined} aria-describedby={typedError ? `${id}-typed-error` : undefined} />
        </div>
        <div>
          <label htmlFor={`${id}-younger`} className="mb-1 block font-semibold">to (million years ago)</label>
          <input id={`${id}-younger`} inputMode="decimal" className="field w-32" value={typed.younger} placeholder="0" onChange={(e) => setTyped((t) => ({ ...t, younger: e.target.value }))} />
        </div>
        <button type="submit" className="btn-quiet">Draw this stretch</button>
        {win ? <button type="button" className="btn-quiet" onClick={() => { setWin(null); setTyped({ older: "", younger: "" }); }}>Whole chart again</button> : null}
        {typedError ? <p id={`${id}-typed-error`} className="basis-full text-danger" role="alert">{typedError}</p> : null}
      </form>
      <p className="mb-2 font-sans text-sm text-ink-soft" aria-live="polite">
        Drawn: {spanText}
        {spacing === "scale" ? ` · each pixel of height is about ${perPixel >= 1 ? `${Number(perPixel.toPrecision(2)).toLocaleString("en-GB")} million` : `${Number((perPixel * 1000).toPrecision(2)).toLocaleString("en-GB")} thousand`} years` : ""}
        {" · choose a box for its details."}
      </p>
      {chosen ? <IntervalCard iv={chosen} onShow={() => showInterval(chosen)} onClose={() => setSelected(null)} /> : null}
      <div className="scroll-x rounded border border-rule bg-white">
        <svg
          width={width}
          height={svgHeight}
          viewBox={`0 0 ${width} ${svgHeight}`}
          role="group"
          aria-labelledby={`${id}-title`}
          className="font-sans"
          data-testid="timescale-chart"
        >
          <title id={`${id}-title`}>{`${title}: ${layout.columns.map((r) => RANK_LABELS[r].toLowerCase()).join(", ")}; ${spanText}; ${spacing === "even" ? "evenly spaced boundaries" : "to scale"}`}</title>
          <Group left={axis} top={0}>
            {layout.columns.map((r, i) => (
              <text key={r} x={layout.columnX[i] + 6} y={19} fontSize={12} fontWeight={600} fill={INK}>
                {RANK_LABELS[r]}
              </text>
            ))}
            <text x={layout.columnsWidth + 8} y={19} fontSize={12} fontWeight={600} fill={INK}>Base (Ma)</text>
          </Group>
          <Group left={axis} top={HEADER}>
            {layout.boxes.map((b) => {
              const tip = `${b.iv.name} (${RANK_LABELS[b.iv.rank].toLowerCase()}): ${fmtBase(b.iv)} to ${fmtMa(b.iv.topMa)} million years ago`;
              const select = () => setSelected(b.iv.name);
              // The box is the button; its name is drawn in a separate layer (below), so the button's
              // accessible name is the whole name even where the drawn one is shortened.
              return (
                <g
                  key={b.iv.name}
                  role="button"
                  tabIndex={0}
                  aria-label={`${tip}. Details`}
                  aria-pressed={selected === b.iv.name}
                  onClick={select}
                  onKeyDown={(e: React.KeyboardEvent) => {
                    if (e.key === "Enter" || e.key === " ") {
                      e.preventDefault();
                      select();
                    }
                  }}
                  className="cursor-pointer outline-none [&:focus-visible>rect]:stroke-sandstone-600 [&:focus-visible>rect]:[stroke-width:3px] [&:hover>rect]:[stroke-width:2px]"
                >
                  <title>{tip}</title>
                  <rect x={b.x + 0.5} y={b.y} width={b.width - 1} height={b.height} fill={b.iv.color} stroke={selected === b.iv.name ? "#9a5624" : INK} strokeOpacity={selected === b.iv.name ? 1 : 0.45} strokeWidth={selected === b.iv.name ? 3 : 1} />
                </g>
              );
            })}
            <g aria-hidden="true" pointerEvents="none">
              {layout.boxes.map((b) => {
                const label = b.height >= 12 ? fitLabel(b.iv.name, b.width) : null;
                return label
                  ? labelPositions(b.y, b.height).map((ly) => (
                      <text key={`${b.iv.name}-${ly}`} x={b.x + 6} y={ly} dominantBaseline="central" fontSize={12} fill={textOn(b.iv.color)}>
                        {label}
                      </text>
                    ))
                  : null;
              })}
            </g>
            {layout.ageLabels.map((l, i) => (
              <g key={i} aria-hidden="true">
                <line x1={layout.columnsWidth} x2={layout.columnsWidth + 5} y1={l.y} y2={l.y} stroke={INK} />
                <text x={layout.columnsWidth + 8} y={l.y} dominantBaseline="central" fontSize={11} fill={INK} className="figures">
                  {l.text}
                </text>
              </g>
            ))}
          </Group>
          {spacing === "scale" ? (
            <AxisLeft
              scale={layout.y}
              left={axis - 2}
              top={HEADER}
              numTicks={10}
              stroke={INK}
              tickStroke={INK}
              tickFormat={(v) => fmtMa(Number(v))}
              tickLabelProps={() => ({ fill: INK, fontSize: 11, textAnchor: "end", dx: -2, dy: "0.33em" })}
            />
          ) : null}
        </svg>
      </div>
      <p className="mt-2 font-sans text-xs text-ink-soft">
        Boxes use the standard chart colours; names and ages are written on them. “~” marks an approximate age, “±” the uncertainty of a base (give or take).
      </p>
    </div>
  );
}

/** What the chart knows about one interval, in plain words, with a way to draw just its time. */
function IntervalCard({ iv, onShow, onClose }: { iv: Interval; onShow: () => void; onClose: () => void }) {
  const years = iv.baseMa - iv.topMa;
  const kind = iv.gssp === null ? "The source does not say how its start is defined." : !iv.gssp ? "Its start is not yet ratified: the age is provisional." : iv.boundaryKind === "GSSA" ? "Its start is a GSSA: a boundary defined by an agreed number of years." : iv.boundaryKind === "GSSP" ? "Its start is a GSSP: a reference point in one rock section, chosen by international agreement." : "Its start is ratified.";
  return (
    <div className="mb-3 flex flex-wrap items-start justify-between gap-3 rounded border-l-4 bg-white p-3 font-sans text-sm" style={{ borderColor: iv.color }} role="region" aria-label={`About the ${iv.name}`}>
      <div className="min-w-0">
        <p className="font-semibold">{iv.name} <span className="font-normal text-ink-soft">({RANK_LABELS[iv.rank].toLowerCase()}{iv.parent ? ` within the ${iv.parent}` : ""})</span></p>
        <p>From {fmtBase(iv)} to {fmtMa(iv.topMa)} million years ago: it lasted {years >= 1 ? `${Number(years.toPrecision(4)).toLocaleString("en-GB")} million` : `${Number((years * 1000).toPrecision(4)).toLocaleString("en-GB")} thousand`} years. {kind}</p>
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-quiet" onClick={onShow}>Draw only its time</button>
        <button type="button" className="btn-quiet" onClick={onClose}>Close</button>
      </div>
    </div>
  );
}
