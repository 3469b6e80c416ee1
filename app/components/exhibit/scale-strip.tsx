// The exhibit drawn as a strip from its older end (left) to its younger end (right): chart-colour
// bands with their names, a ruler at round lengths, numbered markers whose labels never overlap
// (staggered rows with leader lines; a crowd becomes one group label that expands below), and each
// inset as a lettered bracket on the strip with its own magnified bar underneath. Drawn at the
// width of the page in true pixels, so its text stays at least 11 px tall on a phone.
import { scaleLinear } from "d3-scale";
import { useMemo } from "react";
import type { ScaleResult } from "~/lib/scale/compute";
import { formatLength, inkOn, type Band, type ResolvedMarker, type UnitsPreference } from "~/lib/exhibit";
import { layoutLabels, type PlacedLabel } from "~/components/exhibit/label-layout";
import { rulerTicks } from "~/components/exhibit/ruler";
import { useWidth } from "~/components/exhibit/use-width";

const PAD = 14;
const FONT = "IBM Plex Sans, sans-serif";
const INK = "#1f2430";
const SOFT = "#4a5160";
const CROWDED = "#a3302a";
const LABEL_ROWS = 3;
const ROW_H = 15;
const BAND_ROW_H = 17;
const INSET_BAR_H = 22;
const LETTERS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ";
const LAYOUT = { rows: LABEL_ROWS, charWidth: 6.6, gap: 3 };

export const insetLetter = (k: number) => LETTERS[k % LETTERS.length];

function MarkerLabels({ labels, stripY, up, crowded, names }: { labels: PlacedLabel[]; stripY: number; up: boolean; crowded: Set<string>; names: Map<string, string> }) {
  // Rows go away from the strip: above it (main strip) or below it (an inset's bar).
  const rowY = (row: number) => (up ? stripY - 8 - row * ROW_H : stripY + 16 + row * ROW_H);
  return (
    <>
      {labels.map((l) => {
        const warn = l.ids.some((id) => crowded.has(id));
        const colour = warn ? CROWDED : INK;
        const y = rowY(l.row);
        const lineEnd = up ? y + 3 : y - 11;
        const tip = l.ids.map((id) => names.get(id)).join("; ");
        return (
          <g key={l.ids.join(",")}>
            {l.group ? <path d={`M${l.from},${stripY + (up ? -3 : 3)} V${stripY} H${l.to} V${stripY + (up ? -3 : 3)}`} fill="none" stroke={colour} strokeWidth={1.5} /> : null}
            <line x1={l.anchor} x2={l.anchor} y1={lineEnd} y2={stripY} stroke={colour} strokeWidth={warn ? 1.5 : 1} strokeDasharray={warn ? "3 2" : undefined} />
            <text x={l.x} y={y} textAnchor="middle" fontSize={11} fontWeight={warn || l.group ? 700 : 400} fill={colour} fontFamily={FONT}>
              {l.text}
              <title>{tip}</title>
            </text>
          </g>
        );
      })}
    </>
  );
}

export function ScaleStrip({
  result,
  markers,
  bands,
  units,
  flagged,
  title,
}: {
  result: ScaleResult;
  markers: ResolvedMarker[];
  bands: Band[];
  units: UnitsPreference;
  flagged: Set<string>;
  title: string;
}) {
  const [ref, W] = useWidth<HTMLDivElement>(1000);
  const { scale } = result;
  const narrow = W < 600;
  const headerH = narrow ? 34 : 20;
  const stripY = headerH + 8 + LABEL_ROWS * ROW_H + 4;
  const rankRows = [...new Set(bands.map((b) => b.rank))];
  const stripH = Math.max(1, rankRows.length) * BAND_ROW_H;
  const axisY = stripY + stripH;
  const bracketsY = axisY + 34;
  const insetsY = bracketsY + result.insets.length * 12 + 12;

  const drawn = useMemo(() => {
    const x = scaleLinear().domain([0, scale.totalMetres]).range([PAD, W - PAD]);
    const olderMa = scale.olderYears / 1e6;
    const youngerMa = scale.youngerYears / 1e6;
    const atMa = (ma: number) => x((olderMa - ma) * 1e6 * scale.metresPerYear);
    const names = new Map(markers.map((m) => [m.id, `${m.number}. ${m.label}`]));
    const byId = new Map(result.points.map((p) => [p.id, p]));
    const items = markers.flatMap((m) => {
      const p = byId.get(m.id);
      return p ? [{ id: m.id, text: String(m.number), x: x(p.fromOlderEndMetres) }] : [];
    });
    const labels = layoutLabels(items, { ...LAYOUT, width: W });
    const visibleBands = bands
      .map((b) => ({ ...b, base: Math.min(b.baseMa, olderMa), top: Math.max(b.topMa, youngerMa), row: rankRows.indexOf(b.rank) }))
      .filter((b) => b.base > b.top)
      .map((b) => ({ ...b, x0: atMa(b.base), x1: atMa(b.top) }));
    const ticks = rulerTicks(scale.totalMetres, units, Math.max(2, Math.floor((W - 2 * PAD) / 90)));
    const insets = result.insets.map((inset) => {
      const ix = scaleLinear().domain([inset.olderYears, inset.youngerYears]).range([PAD + 22, W - PAD]);
      const inside = markers.filter((m) => inset.pointIds.includes(m.id));
      const insetLabels = layoutLabels(inside.map((m) => ({ id: m.id, text: String(m.number), x: ix(m.ageMa * 1e6) })), { ...LAYOUT, rows: 2, width: W });
      return { inset, a: x(inset.mainFromOlderEndMetres), b: x(inset.mainToOlderEndMetres), labels: insetLabels };
    });
    // Each inset's block is as tall as its label rows need.
    const insetTops: number[] = [];
    let next = insetsY;
    for (const ins of insets) {
      insetTops.push(next);
      next += INSET_BAR_H + 10 + (ins.labels.length ? Math.max(...ins.labels.map((l) => l.row)) + 1 : 0) * ROW_H + 10;
    }
    return { names, labels, visibleBands, ticks, insets, x, insetTops, height: next + 4 };
    // rankRows is derived from bands
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [W, scale, markers, bands, result.points, result.insets, units, insetsY]);
  const height = drawn.height;

  const start = `Start (older end): ${scale.olderYears >= 1e6 ? `${(scale.olderYears / 1e6).toLocaleString("en-GB")} million years ago` : `${scale.olderYears.toLocaleString("en-GB")} years ago`}`;
  const end = `End (younger end): ${scale.youngerYears === 0 ? "the present" : `${scale.youngerYears.toLocaleString("en-GB")} years ago`}`;
  const groups = drawn.labels.filter((l) => l.group);

  return (
    <figure className="m-0">
      <div ref={ref} className="overflow-hidden rounded border border-rule bg-white">
      <svg width={W} height={height} viewBox={`0 0 ${W} ${height}`} role="img" aria-labelledby="strip-title strip-desc" className="block h-auto max-w-full" data-testid="scale-strip">
        <title id="strip-title">{title}</title>
        <desc id="strip-desc">
          {`The exhibit from ${scale.olderYears.toLocaleString("en-GB")} years ago at the left to ${scale.youngerYears.toLocaleString("en-GB")} years ago at the right, ${formatLength(scale.totalMetres, units)} long, with ${markers.length} markers and ${result.insets.length} insets.`}
        </desc>
        <text x={PAD} y={14} fontSize={12} fill={SOFT} fontFamily={FONT}>{start}</text>
        <text x={W - PAD} y={narrow ? 29 : 14} fontSize={12} fill={SOFT} textAnchor="end" fontFamily={FONT}>{end}</text>
        {drawn.visibleBands.map((b) => {
          const w = Math.max(0.5, b.x1 - b.x0);
          return (
            <g key={b.name}>
              <rect x={b.x0} y={stripY + b.row * BAND_ROW_H} width={w} height={BAND_ROW_H} fill={b.color} stroke="#ffffff" strokeWidth={0.5}>
                <title>{`${b.name} (${b.rank}): ${b.baseMa}–${b.topMa} million years ago`}</title>
              </rect>
              {w > b.name.length * 6.4 + 6 ? (
                <text x={b.x0 + w / 2} y={stripY + b.row * BAND_ROW_H + BAND_ROW_H / 2 + 4} textAnchor="middle" fontSize={11} fill={inkOn(b.color)} fontFamily={FONT} pointerEvents="none">
                  {b.name}
                </text>
              ) : null}
            </g>
          );
        })}
        <rect x={PAD} y={stripY} width={W - 2 * PAD} height={stripH} fill="none" stroke={INK} />
        <MarkerLabels labels={drawn.labels} stripY={stripY} up crowded={flagged} names={drawn.names} />
        <g aria-hidden="true">
          <line x1={PAD} x2={W - PAD} y1={axisY} y2={axisY} stroke={SOFT} />
          {drawn.ticks.map((t, i) => {
            const tx = drawn.x(t.metres);
            const anchor = i === 0 ? "start" : i === drawn.ticks.length - 1 && tx > W - PAD - 30 ? "end" : "middle";
            return (
              <g key={t.metres}>
                <line x1={tx} x2={tx} y1={axisY} y2={axisY + 6} stroke={SOFT} />
                <text x={tx} y={axisY + 19} textAnchor={anchor} fontSize={11} fill={SOFT} fontFamily={FONT}>{t.label}</text>
              </g>
            );
          })}
        </g>
        {drawn.insets.map(({ inset, a, b, labels }, k) => {
          const by = bracketsY + k * 12;
          const top = drawn.insetTops[k];
          const letter = insetLetter(k);
          const right = Math.max(b, a + 3);
          const letterX = right + 10 > W - PAD ? a - 4 : right + 4;
          return (
            <g key={inset.id}>
              <path d={`M${a},${by - 4} V${by} H${right} V${by - 4}`} fill="none" stroke="#284955" strokeWidth={1.5} />
              <text x={letterX} y={by + 4} textAnchor={letterX < a ? "end" : "start"} fontSize={11} fontWeight={700} fill="#284955" fontFamily={FONT}>{letter}</text>
              <text x={PAD} y={top + INSET_BAR_H / 2 + 5} fontSize={13} fontWeight={700} fill="#284955" fontFamily={FONT}>{letter}</text>
              <rect x={PAD + 22} y={top} width={W - 2 * PAD - 22} height={INSET_BAR_H} fill="#dde8ec" stroke="#284955">
                <title>{`Inset ${letter}: ${inset.label} — ${inset.statement.lengthPerTime}`}</title>
              </rect>
              <MarkerLabels labels={labels} stripY={top + INSET_BAR_H} up={false} crowded={new Set()} names={drawn.names} />
            </g>
          );
        })}
      </svg>
      </div>
      <figcaption className="mt-2 font-sans text-sm text-ink-soft">
        {scale.statement.lengthPerTime} ({scale.statement.timePerLength}). Bands in the standard chart colours, named where they fit (point at one for its ages). Numbers are markers; <span className="font-semibold text-danger">bold red numbers on dashed lines</span> stand too close together.
        {result.insets.length ? ` Insets: ${result.insets.map((ins, k) => `${insetLetter(k)} — ${ins.label}, ${ins.statement.lengthPerTime}, ${formatLength(ins.lengthMetres, units, ins.lengthMetres / 1000)} long`).join("; ")}.` : ""}
      </figcaption>
      {groups.length ? (
        <div className="mt-1 flex flex-wrap items-start gap-1 font-sans text-sm">
          <span className="py-0.5 text-ink-soft">Crowded, labelled as one (open for the names):</span>
          {groups.map((g) => (
            <details key={g.ids.join(",")} className="rounded border border-rule bg-paper px-1.5 py-0.5">
              <summary className="cursor-pointer">{g.text}</summary>
              <ol className="mt-1 space-y-0.5">
                {g.ids.map((id) => <li key={id}><a href={`#marker-${id}`}>{drawn.names.get(id)}</a></li>)}
              </ol>
            </details>
          ))}
        </div>
      ) : null}
    </figure>
  );
}
