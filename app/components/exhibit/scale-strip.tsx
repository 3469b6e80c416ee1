// The exhibit drawn as a strip from its older end (left) to its younger end (right): chart-colour
// bands with their names, numbered markers (crowded ones flagged), and each inset as a magnified
// call-out below, joined to the part of the strip it enlarges.
import { scaleLinear } from "d3-scale";
import { Group } from "@visx/group";
import { AxisBottom } from "@visx/axis";
import type { ScaleResult } from "~/lib/scale/compute";
import { formatLength, inkOn, type Band, type ResolvedMarker, type UnitsPreference } from "~/lib/exhibit";

const W = 1000;
const PAD = 24;
const STRIP_Y = 64;
const STRIP_H = 54;
const INSET_H = 30;
const INSET_GAP = 86;

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
  const { scale } = result;
  const x = scaleLinear().domain([0, scale.totalMetres]).range([PAD, W - PAD]);
  const olderMa = scale.olderYears / 1e6;
  const youngerMa = scale.youngerYears / 1e6;
  const atMa = (ma: number) => x((olderMa - ma) * 1e6 * scale.metresPerYear);
  const byId = new Map(result.points.map((p) => [p.id, p]));
  // One row per rank (eon above, finest below), so every part of the span is coloured.
  const rankRows = [...new Set(bands.map((b) => b.rank))];
  const rowH = STRIP_H / Math.max(1, rankRows.length);
  const visibleBands = bands
    .map((b) => ({ ...b, base: Math.min(b.baseMa, olderMa), top: Math.max(b.topMa, youngerMa), row: rankRows.indexOf(b.rank) }))
    .filter((b) => b.base > b.top);
  const height = STRIP_Y + STRIP_H + 40 + result.insets.length * (INSET_GAP + INSET_H) + 10;

  return (
    <figure className="m-0">
      <svg viewBox={`0 0 ${W} ${height}`} role="img" aria-labelledby="strip-title strip-desc" className="h-auto w-full rounded border border-rule bg-white">
        <title id="strip-title">{title}</title>
        <desc id="strip-desc">
          {`The exhibit from ${scale.olderYears.toLocaleString("en-GB")} years ago at the left to ${scale.youngerYears.toLocaleString("en-GB")} years ago at the right, ${formatLength(scale.totalMetres, units)} long, with ${markers.length} markers and ${result.insets.length} insets.`}
        </desc>
        {/* chart-colour bands */}
        <Group top={STRIP_Y}>
          {visibleBands.map((b) => {
            const x0 = atMa(b.base);
            const x1 = atMa(b.top);
            const w = Math.max(0.5, x1 - x0);
            return (
              <g key={b.name}>
                <rect x={x0} y={b.row * rowH} width={w} height={rowH} fill={b.color} stroke="#ffffff" strokeWidth={0.5}>
                  <title>{`${b.name} (${b.rank}): ${b.baseMa}–${b.topMa} Ma`}</title>
                </rect>
                {w > b.name.length * 5.8 ? (
                  <text x={x0 + w / 2} y={b.row * rowH + rowH / 2 + 3.5} textAnchor="middle" fontSize={Math.min(11, rowH - 5)} fill={inkOn(b.color)} fontFamily="IBM Plex Sans, sans-serif">
                    {b.name}
                  </text>
                ) : null}
              </g>
            );
          })}
          <rect x={PAD} width={W - 2 * PAD} height={STRIP_H} fill="none" stroke="#1f2430" />
        </Group>
        {/* markers */}
        {markers.map((m, i) => {
          const p = byId.get(m.id);
          if (!p) return null;
          const mx = x(p.fromOlderEndMetres);
          const crowded = flagged.has(m.id);
          const row = i % 2;
          return (
            <g key={m.id}>
              <line x1={mx} x2={mx} y1={STRIP_Y - 6 - row * 14} y2={STRIP_Y + STRIP_H} stroke={crowded ? "#a3302a" : "#1f2430"} strokeWidth={crowded ? 1.5 : 1} />
              <text x={mx} y={STRIP_Y - 9 - row * 14} textAnchor="middle" fontSize={11} fontWeight={crowded ? 700 : 400} fill={crowded ? "#a3302a" : "#1f2430"} fontFamily="IBM Plex Sans, sans-serif">
                {m.number}
                <title>{`${m.number}. ${m.label} — ${p.display.fromOlderEnd} from the start${crowded ? " (crowded)" : ""}`}</title>
              </text>
            </g>
          );
        })}
        <AxisBottom
          top={STRIP_Y + STRIP_H}
          scale={x}
          numTicks={8}
          tickFormat={(v) => formatLength(Number(v), units, scale.totalMetres / 100)}
          stroke="#4a5160"
          tickStroke="#4a5160"
          tickLabelProps={{ fontSize: 11, fill: "#4a5160", fontFamily: "IBM Plex Sans, sans-serif", textAnchor: "middle" }}
        />
        {/* insets */}
        {result.insets.map((inset, k) => {
          const top = STRIP_Y + STRIP_H + 40 + k * (INSET_GAP + INSET_H) + INSET_GAP - 30;
          const a = x(inset.mainFromOlderEndMetres);
          const b = x(inset.mainToOlderEndMetres);
          const ix = scaleLinear().domain([inset.olderYears, inset.youngerYears]).range([PAD + 40, W - PAD - 40]);
          const inside = markers.filter((m) => inset.pointIds.includes(m.id));
          return (
            <g key={inset.id}>
              <path d={`M${a},${STRIP_Y + STRIP_H} L${PAD + 40},${top} L${W - PAD - 40},${top} L${b},${STRIP_Y + STRIP_H} Z`} fill="#3d6b7a" opacity={0.08} />
              <line x1={a} y1={STRIP_Y + STRIP_H} x2={PAD + 40} y2={top} stroke="#3d6b7a" strokeDasharray="4 3" />
              <line x1={b} y1={STRIP_Y + STRIP_H} x2={W - PAD - 40} y2={top} stroke="#3d6b7a" strokeDasharray="4 3" />
              <rect x={PAD + 40} y={top} width={W - 2 * PAD - 80} height={INSET_H} fill="#dde8ec" stroke="#284955" />
              <text x={PAD + 44} y={top - 6} fontSize={12} fill="#284955" fontFamily="IBM Plex Sans, sans-serif" fontWeight={600}>
                {`Inset: ${inset.label} — ${inset.statement.lengthPerTime}, ${formatLength(inset.lengthMetres, units)} long`}
              </text>
              {inside.map((m) => {
                const mx = ix(m.ageMa * 1e6);
                return (
                  <g key={m.id}>
                    <line x1={mx} x2={mx} y1={top} y2={top + INSET_H} stroke="#1f2430" />
                    <text x={mx} y={top + INSET_H + 13} textAnchor="middle" fontSize={11} fill="#1f2430" fontFamily="IBM Plex Sans, sans-serif">
                      {m.number}
                    </text>
                  </g>
                );
              })}
            </g>
          );
        })}
        <text x={PAD} y={14} fontSize={12} fill="#4a5160" fontFamily="IBM Plex Sans, sans-serif">
          {`Start (older end): ${scale.olderYears >= 1e6 ? `${(scale.olderYears / 1e6).toLocaleString("en-GB")} million years ago` : `${scale.olderYears.toLocaleString("en-GB")} years ago`}`}
        </text>
        <text x={W - PAD} y={14} fontSize={12} fill="#4a5160" textAnchor="end" fontFamily="IBM Plex Sans, sans-serif">
          {`End (younger end): ${scale.youngerYears === 0 ? "the present" : `${scale.youngerYears.toLocaleString("en-GB")} years ago`}`}
        </text>
      </svg>
      <figcaption className="mt-2 font-sans text-sm text-ink-soft">
        {scale.statement.lengthPerTime} · {scale.statement.timePerLength}. Bands in the standard chart colours, each named where it fits (hover for its ages); numbers are markers, in red where they crowd.
      </figcaption>
    </figure>
  );
}
