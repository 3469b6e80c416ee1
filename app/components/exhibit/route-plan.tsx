// A plan of a route exhibit: the path, where the walk starts (the older end) and ends, and the markers.
import type { ScaleResult } from "~/lib/scale/compute";
import type { LineStringGeometry, ResolvedMarker } from "~/lib/exhibit";

const W = 600;
const H = 360;
const M = 24;

export function RoutePlan({ geometry, result, markers }: { geometry: LineStringGeometry; result: ScaleResult | null; markers: ResolvedMarker[] }) {
  const coords = geometry.coordinates as number[][];
  const step = Math.max(1, Math.floor(coords.length / 2000));
  const pts = coords.filter((_, i) => i % step === 0 || i === coords.length - 1);
  const lat0 = (Math.min(...pts.map((p) => p[1])) + Math.max(...pts.map((p) => p[1]))) / 2;
  const k = Math.cos((lat0 * Math.PI) / 180);
  const xs = pts.map((p) => p[0] * k);
  const ys = pts.map((p) => -p[1]);
  const [minX, maxX, minY, maxY] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const s = Math.min((W - 2 * M) / (maxX - minX || 1), (H - 2 * M) / (maxY - minY || 1));
  const px = (lon: number) => M + (lon * k - minX) * s + ((W - 2 * M) - (maxX - minX) * s) / 2;
  const py = (lat: number) => M + (-lat - minY) * s + ((H - 2 * M) - (maxY - minY) * s) / 2;
  const d = pts.map((p, i) => `${i ? "L" : "M"}${px(p[0]).toFixed(1)},${py(p[1]).toFixed(1)}`).join(" ");
  const first = coords[0];
  const last = coords[coords.length - 1];
  const byId = new Map(result?.points.map((p) => [p.id, p]) ?? []);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label="Plan of the route with its start, end and markers" className="h-auto max-h-[420px] w-full rounded border border-rule bg-[#f2f5f3]">
      <path d={d} fill="none" stroke="#3d6b7a" strokeWidth={3} strokeLinejoin="round" />
      {markers.map((m) => {
        const p = byId.get(m.id)?.position;
        if (!p) return null;
        return (
          <g key={m.id}>
            <circle cx={px(p.lon)} cy={py(p.lat)} r={4} fill={m.color} stroke="#1f2430" />
            <title>{`${m.number}. ${m.label}`}</title>
          </g>
        );
      })}
      <g>
        <circle cx={px(first[0])} cy={py(first[1])} r={7} fill="#2f6b3a" />
        <text x={px(first[0]) + 10} y={py(first[1]) + 4} fontSize={13} fontFamily="IBM Plex Sans, sans-serif" fill="#1f2430" fontWeight={600}>Start (oldest)</text>
      </g>
      <g>
        <rect x={px(last[0]) - 6} y={py(last[1]) - 6} width={12} height={12} fill="#a3302a" />
        <text x={px(last[0]) + 10} y={py(last[1]) + 4} fontSize={13} fontFamily="IBM Plex Sans, sans-serif" fill="#1f2430" fontWeight={600}>End (present)</text>
      </g>
    </svg>
  );
}
