// The chart of one edition: a column per rank (eon … age) on a vertical time axis, youngest at the
// top, each interval a box in its standard chart colour with its name. An interval whose next rank
// down is missing (the Hadean, the Precambrian periods, the Pridoli, ranks that are hidden) widens
// to the right until its own subdivisions begin. Two spacings: even (every boundary one step, so
// every name is legible) and to scale (time as distance, as on an exhibit). Columns collapse by
// rank; selecting a box with subdivisions zooms to it.
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
  zoomable: boolean;
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
  const [focus, setFocus] = useState<string | null>(null);
  const [spacing, setSpacing] = useState<Spacing>(initialSpacing);

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

  const focused = focus ? model.byName.get(focus) ?? null : null;
  const visible = model.present.filter((r) => !hidden.has(r));

  const layout = useMemo(() => {
    const all = intervals.filter((iv) => Number.isFinite(iv.baseMa) && Number.isFinite(iv.topMa));
    const windowBase = focused ? focused.baseMa : Math.max(...all.map((iv) => iv.baseMa));
    const windowTop = focused ? focused.topMa : Math.min(...all.map((iv) => iv.topMa));
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
        zoomable: (model.children.get(iv.name)?.length ?? 0) > 0 && iv.name !== focused?.name,
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
  }, [intervals, focused, visible.join(","), spacing, model]);

  const axis = spacing === "scale" ? AXIS : 0;
  const width = axis + layout.columnsWidth + AGE_COLUMN;
  const svgHeight = HEADER + layout.height + 12;

  const ancestry: Interval[] = [];
  for (let cur = focused; cur; cur = cur.parent ? model.byName.get(cur.parent) ?? null : null) ancestry.unshift(cur);
  const zoomChoices = intervals.filter((iv) => (model.children.get(iv.name)?.length ?? 0) > 0);

  const toggle = (r: Rank) =>
    setHidden((prev) => {
      const next = new Set(prev);
      if (next.has(r)) next.delete(r);
      else next.add(r);
      return next;
    });

  const spanText = `${fmtMa(layout.windowBase)} Ma to ${layout.windowTop === 0 ? "the present" : `${fmtMa(layout.windowTop)} Ma`}`;

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
          <legend className="mb-1 font-semibold">Spacing</legend>
          <div className="flex gap-3">
            {(
              [
                ["even", "Even — every name legible"],
                ["scale", "To scale — time as distance"],
              ] as const
            ).map(([value, label]) => (
              <label key={value} className="flex min-h-8 items-center gap-1.5">
                <input type="radio" name={`${id}-spacing`} value={value} checked={spacing === value} onChange={() => setSpacing(value)} />
                {label}
              </label>
            ))}
          </div>
        </fieldset>
        <div>
          <label htmlFor={`${id}-span`} className="mb-1 block font-semibold">Span</label>
          <select id={`${id}-span`} className="field w-auto" value={focus ?? ""} onChange={(e) => setFocus(e.target.value || null)}>
            <option value="">Whole chart</option>
            {zoomChoices.map((iv) => (
              <option key={iv.name} value={iv.name}>
                {"\u2003".repeat(rankDepth(iv.rank))}
                {iv.name} ({RANK_LABELS[iv.rank].toLowerCase()})
              </option>
            ))}
          </select>
        </div>
      </div>
      <nav aria-label="Zoom" className="mb-2 flex flex-wrap items-center gap-1 font-sans text-sm">
        <button type="button" className="underline decoration-dotted disabled:no-underline" onClick={() => setFocus(null)} disabled={!focused}>
          Whole chart
        </button>
        {ancestry.map((iv) => (
          <span key={iv.name} className="flex items-center gap-1">
            <span aria-hidden="true">›</span>
            <button type="button" className="underline decoration-dotted disabled:font-semibold disabled:no-underline" onClick={() => setFocus(iv.name)} disabled={iv.name === focus}>
              {iv.name}
            </button>
          </span>
        ))}
        <span className="ml-2 text-ink-soft">· {spanText}{spacing === "scale" ? ` · 1 px ≈ ${fmtMa(round9((layout.windowBase - layout.windowTop) / layout.height))} Ma` : ""}</span>
      </nav>
      <div className="overflow-x-auto rounded border border-rule bg-white">
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
              const label = b.height >= 12 ? fitLabel(b.iv.name, b.width) : null;
              const fg = textOn(b.iv.color);
              const tip = `${b.iv.name} (${RANK_LABELS[b.iv.rank].toLowerCase()}): ${fmtBase(b.iv)} to ${fmtMa(b.iv.topMa)} Ma`;
              const zoom = () => setFocus(b.iv.name);
              return (
                <g
                  key={b.iv.name}
                  {...(b.zoomable
                    ? {
                        role: "button",
                        tabIndex: 0,
                        "aria-label": `${tip}. Zoom in`,
                        onClick: zoom,
                        onKeyDown: (e: React.KeyboardEvent) => {
                          if (e.key === "Enter" || e.key === " ") {
                            e.preventDefault();
                            zoom();
                          }
                        },
                        className: "cursor-pointer outline-none [&:focus-visible>rect]:stroke-sandstone-600 [&:focus-visible>rect]:[stroke-width:3px] [&:hover>rect]:[stroke-width:2px]",
                      }
                    : {})}
                >
                  <title>{tip}</title>
                  <rect x={b.x + 0.5} y={b.y} width={b.width - 1} height={b.height} fill={b.iv.color} stroke={INK} strokeOpacity={0.45} strokeWidth={1} />
                  {label
                    ? labelPositions(b.y, b.height).map((ly) => (
                        <text key={ly} x={b.x + 6} y={ly} dominantBaseline="central" fontSize={12} fill={fg} pointerEvents="none">
                          {label}
                        </text>
                      ))
                    : null}
                </g>
              );
            })}
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
        Boxes use the standard chart colours; names and ages are written on them. “~” marks an approximate age, “±” the uncertainty of a base. Select a box with subdivisions to zoom in.
      </p>
    </div>
  );
}
