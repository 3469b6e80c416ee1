// A plan of a route exhibit, drawn from the route itself (no map tiles from outside): the path,
// where the walk starts (the older end) and ends (the present), numbered markers (neighbours too
// close to number one by one share a label such as "12–18"), a scale bar and a north arrow.
// Everything stays inside the frame; Start and End never overprint, even on a loop.
import { useMemo } from "react";
import type { ScaleResult } from "~/lib/scale/compute";
import type { LineStringGeometry, ResolvedMarker, UnitsPreference } from "~/lib/exhibit";
import { scaleBar } from "~/components/exhibit/ruler";
import { useWidth } from "~/components/exhibit/use-width";

const M = 30;
/** Room kept under the route for the scale bar and the north arrow, px. */
const FOOT = 40;
const FONT = "IBM Plex Sans, sans-serif";
const INK = "#1f2430";
const PATH = "#3d6b7a";
/** Length of one degree of latitude, m (mean value; common practice for a planning scale bar). */
const METRES_PER_DEGREE = 111_320;

interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}
const clash = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** Where a label beside a point goes: the first of right, left, above, below that stays inside and clear. */
function placeLabel(px: number, py: number, text: string, W: number, H: number, avoid: Box[]): Box & { anchor: "start" | "end" } {
  const w = text.length * 7.4 + 4;
  const h = 16;
  const options: (Box & { anchor: "start" | "end" })[] = [
    { x: px + 11, y: py - 8, w, h, anchor: "start" },
    { x: px - 11 - w, y: py - 8, w, h, anchor: "end" },
    { x: px - w / 2, y: py - 28, w, h, anchor: "start" },
    { x: px - w / 2, y: py + 12, w, h, anchor: "start" },
    { x: px + 11, y: py + 12, w, h, anchor: "start" },
    { x: px - 11 - w, y: py - 28, w, h, anchor: "end" },
  ];
  // Each place slides sideways to stay inside the frame; it must then be clear of the other labels.
  const slid = options.map((b) => ({ ...b, x: Math.min(Math.max(4, b.x), W - 4 - b.w) }));
  const inside = (b: Box) => b.y >= 4 && b.y + b.h <= H - 4;
  const fit = slid.find((b) => inside(b) && !avoid.some((a) => clash(a, b)));
  const chosen = fit ?? slid.find(inside) ?? slid[0];
  return { ...chosen, y: Math.min(Math.max(4, chosen.y), H - 4 - chosen.h) };
}

export function RoutePlan({ geometry, result, markers, units }: { geometry: LineStringGeometry; result: ScaleResult | null; markers: ResolvedMarker[]; units: UnitsPreference }) {
  const [ref, W] = useWidth<HTMLDivElement>(600);
  const H = Math.round(Math.min(440, Math.max(260, W * 0.62)));
  const coords = geometry.coordinates as number[][];
  // The projection and the drawn path depend on the route and the frame only, not on the markers:
  // worked out once, not on every keystroke.
  const { px, py, d, s } = useMemo(() => {
    const step = Math.max(1, Math.floor(coords.length / 2000));
    const pts = coords.filter((_, i) => i % step === 0 || i === coords.length - 1);
    let [minX, maxX, minY, maxY, minLat, maxLat] = [Infinity, -Infinity, Infinity, -Infinity, Infinity, -Infinity];
    for (const p of pts) {
      minLat = Math.min(minLat, p[1]);
      maxLat = Math.max(maxLat, p[1]);
    }
    const k = Math.cos((((minLat + maxLat) / 2) * Math.PI) / 180);
    for (const p of pts) {
      minX = Math.min(minX, p[0] * k);
      maxX = Math.max(maxX, p[0] * k);
      minY = Math.min(minY, -p[1]);
      maxY = Math.max(maxY, -p[1]);
    }
    const s = Math.min((W - 2 * M) / (maxX - minX || 1), (H - 2 * M - FOOT) / (maxY - minY || 1));
    const px = (lon: number) => M + (lon * k - minX) * s + (W - 2 * M - (maxX - minX) * s) / 2;
    const py = (lat: number) => M + (-lat - minY) * s + (H - 2 * M - FOOT - (maxY - minY) * s) / 2;
    const d = pts.map((p, i) => `${i ? "L" : "M"}${px(p[0]).toFixed(1)},${py(p[1]).toFixed(1)}`).join(" ");
    return { px, py, d, s };
  }, [coords, W, H]);
  const first = coords[0];
  const last = coords[coords.length - 1];
  const byId = new Map(result?.points.map((p) => [p.id, p]) ?? []);

  // Marker labels: numbered discs; neighbours closer than a disc share one label.
  const clusters: { x: number; y: number; members: ResolvedMarker[] }[] = [];
  for (const m of markers) {
    const p = byId.get(m.id)?.position;
    if (!p) continue;
    const mx = px(p.lon);
    const my = py(p.lat);
    // Two labels closer than a label's size would overprint: they share one.
    const near = clusters.find((c) => Math.abs(c.x - mx) < 48 && Math.abs(c.y - my) < 22);
    if (near) near.members.push(m);
    else clusters.push({ x: mx, y: my, members: [m] });
  }
  const discs = clusters.map((c) => {
    const text = c.members.length === 1 ? String(c.members[0].number) : `${c.members[0].number}–${c.members[c.members.length - 1].number}`;
    const w = Math.max(20, text.length * 7 + 10);
    return { ...c, text, w, x: Math.min(Math.max(c.x, 4 + w / 2), W - 4 - w / 2), y: Math.min(Math.max(c.y, 14), H - FOOT) };
  });

  const startXY = { x: px(first[0]), y: py(first[1]) };
  const endXY = { x: px(last[0]), y: py(last[1]) };
  const discBoxes: Box[] = discs.map((c) => ({ x: c.x - c.w / 2, y: c.y - 10, w: c.w, h: 20 }));
  const startLabel = placeLabel(startXY.x, startXY.y, "Start (oldest)", W, H - FOOT, discBoxes);
  const endLabel = placeLabel(endXY.x, endXY.y, "End (present)", W, H - FOOT, [...discBoxes, startLabel]);

  const metresPerPx = METRES_PER_DEGREE / s;
  const bar = scaleBar(metresPerPx * Math.min(160, W / 3), units);
  const barPx = bar.metres / metresPerPx;

  return (
    <div ref={ref} className="overflow-hidden rounded border border-rule bg-[#f2f5f3]">
      <svg width={W} height={H} viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="plan-title" className="block h-auto max-w-full" data-testid="route-plan">
        <title id="plan-title">{`Plan of the route, north up: the walk starts at the oldest end and ends at the present; ${markers.length} numbered markers, listed with their coordinates in the markers table.`}</title>
        <path d={d} fill="none" stroke={PATH} strokeWidth={3} strokeLinejoin="round" />
        <circle cx={startXY.x} cy={startXY.y} r={7} fill="#2f6b3a" stroke="white" strokeWidth={2} />
        <rect x={endXY.x - 6} y={endXY.y - 6} width={12} height={12} fill="#a3302a" stroke="white" strokeWidth={2} />
        {discs.map((c) => (
          <g key={c.members[0].id}>
            <title>{c.members.map((m) => `${m.number}. ${m.label}`).join("; ")}</title>
            <rect x={c.x - c.w / 2} y={c.y - 10} width={c.w} height={20} rx={10} fill="white" stroke={INK} strokeWidth={1.2} />
            <text x={c.x} y={c.y + 4} textAnchor="middle" fontSize={11} fontWeight={700} fill={INK} fontFamily={FONT}>{c.text}</text>
          </g>
        ))}
        {[
          { label: startLabel, text: "Start (oldest)" },
          { label: endLabel, text: "End (present)" },
        ].map(({ label, text }) => (
          <text key={text} x={label.x + 2} y={label.y + 12} fontSize={13} fontWeight={700} fill={INK} fontFamily={FONT} stroke="white" strokeWidth={4} paintOrder="stroke" strokeLinejoin="round">
            {text}
          </text>
        ))}
        <g transform={`translate(${W - 20}, ${H - 36})`} aria-hidden="true">
          <path d="M0,0 L7,18 L0,13 L-7,18 Z" fill={INK} />
          <text x={-12} y={14} textAnchor="end" fontSize={12} fontWeight={700} fill={INK} fontFamily={FONT}>N</text>
        </g>
        <g transform={`translate(12, ${H - 14})`} aria-hidden="true">
          <rect x={0} y={-6} width={barPx} height={6} fill="white" stroke={INK} />
          <rect x={0} y={-6} width={barPx / 2} height={6} fill={INK} />
          <text x={barPx + 6} y={0} fontSize={11} fill={INK} fontFamily={FONT}>{bar.label} (approximate)</text>
        </g>
      </svg>
    </div>
  );
}
