// Moved boundaries between two editions: one row per boundary (youngest at the top, as on the
// chart), a bar from zero to the shift in Ma (right = the base is now older), in the colour of
// the interval the boundary starts, with the figures written beside every bar.
import { AxisBottom } from "@visx/axis";
import { Group } from "@visx/group";
import { scaleLinear } from "d3-scale";
import { INK } from "~/lib/chart/colour";
import type { MovedBoundary } from "~/lib/chart/compare-model";
import { fmtMa, fmtShift } from "~/lib/chart/format";

const ROW = 24;
const LABEL = 250;
const PLOT = 460;
const VALUE = 150;
const TOP = 28;
const AXIS = 40;

export function ShiftChart({ rows, title }: { rows: readonly MovedBoundary[]; title: string }) {
  if (rows.length === 0) return null;
  const max = Math.max(...rows.map((r) => Math.abs(r.shiftMa))) || 1;
  const x = scaleLinear<number>().domain([-max, max]).range([0, PLOT]).nice();
  const height = TOP + rows.length * ROW + AXIS;
  const width = LABEL + PLOT + VALUE;
  return (
    <div className="scroll-x rounded border border-rule bg-white" tabIndex={0} role="region" aria-label="Chart of the moved boundaries (scrolls sideways on narrow screens)">
      <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-labelledby="shift-chart-title" className="font-sans" data-testid="shift-chart">
        <title id="shift-chart-title">{title}</title>
        <text x={LABEL + x(0)} y={16} textAnchor="middle" fontSize={12} fill={INK} fontWeight={600}>
          ← younger · shift of the base (Ma) · older →
        </text>
        <Group top={TOP}>
          <line x1={LABEL + x(0)} x2={LABEL + x(0)} y1={0} y2={rows.length * ROW} stroke={INK} />
          {rows.map((r, i) => {
            const y = i * ROW;
            const x0 = x(Math.min(0, r.shiftMa));
            const x1 = x(Math.max(0, r.shiftMa));
            const extra = r.names.length - 1;
            const label = `${r.names[0]}${extra ? ` & ${extra} more` : ""}`;
            const valueText = `${fmtShift(r.shiftMa)} Ma (${fmtMa(r.oldBaseMa)} → ${fmtMa(r.newBaseMa)})`;
            return (
              <g key={r.key}>
                <title>{`Base of ${r.names.join(", ")}: ${fmtMa(r.oldBaseMa)} → ${fmtMa(r.newBaseMa)} Ma (${fmtShift(r.shiftMa)} Ma)`}</title>
                {i % 2 === 0 ? <rect x={0} y={y} width={width} height={ROW} fill="#f7f4ee" /> : null}
                <text x={LABEL - 8} y={y + ROW / 2} textAnchor="end" dominantBaseline="central" fontSize={12} fill={INK}>
                  {label.length > 34 ? `${label.slice(0, 33)}…` : label}
                </text>
                <rect x={LABEL + x0} y={y + 4} width={Math.max(2, x1 - x0)} height={ROW - 8} fill={r.color} stroke={INK} strokeWidth={1} />
                <text x={LABEL + PLOT + 6} y={y + ROW / 2} dominantBaseline="central" fontSize={11} fill={INK} className="figures">
                  {valueText}
                </text>
              </g>
            );
          })}
        </Group>
        <AxisBottom
          scale={x}
          top={TOP + rows.length * ROW}
          left={LABEL}
          numTicks={8}
          stroke={INK}
          tickStroke={INK}
          tickFormat={(v) => fmtShift(Number(v))}
          tickLabelProps={() => ({ fill: INK, fontSize: 11, textAnchor: "middle" })}
        />
      </svg>
    </div>
  );
}
