// The route map: the published track (simplified to what the drawing can show) with numbered
// marker circles, Start and End, a scale bar and a north arrow; no tiles from anywhere.
import type { RouteMapModel } from "../../lib/visit/route-map";
import type { Messages } from "../../lib/visit/messages";

export function RouteMap({ map, t }: { map: RouteMapModel; t: Messages }) {
  const barY = map.height - 10;
  return (
    <svg className="visit-map" viewBox={`0 0 ${map.width} ${map.height}`} role="img" aria-labelledby="visit-map-title">
      <title id="visit-map-title">{t.mapLabel}</title>
      <path d={map.path} fill="none" stroke="#3d6b7a" strokeWidth={3} strokeLinejoin="round" strokeLinecap="round" />
      <text x={map.start.x} y={map.start.y + (map.start.y > map.height / 2 ? -16 : 26)} fontSize={13} fontWeight={700} textAnchor={map.start.x > map.width / 2 ? "end" : "start"} fill="#1f2430">
        {t.mapStart}
      </text>
      <text x={map.end.x} y={map.end.y + (map.end.y > map.height / 2 ? -16 : 26)} fontSize={13} fontWeight={700} textAnchor={map.end.x > map.width / 2 ? "end" : "start"} fill="#1f2430">
        {t.mapEnd}
      </text>
      {map.markers.map((m) =>
        m.numbered ? (
          <g key={m.signNumber}>
            <circle cx={m.x} cy={m.y} r={10} fill="#ffffff" stroke="#1f2430" strokeWidth={1.5} />
            <text x={m.x} y={m.y + 4} fontSize={11} fontWeight={700} textAnchor="middle" fill="#1f2430">
              {m.signNumber}
            </text>
          </g>
        ) : (
          <circle key={m.signNumber} cx={m.x} cy={m.y} r={3} fill="#1f2430" />
        ),
      )}
      <g aria-hidden="true">
        <line x1={10} y1={barY} x2={10 + map.scaleBar.width} y2={barY} stroke="#1f2430" strokeWidth={3} />
        <text x={10} y={barY - 6} fontSize={13} fill="#1f2430">
          {map.scaleBar.text}
        </text>
        <path d={`M${map.width - 20} 30 l-7 14 h14 z`} fill="#1f2430" />
        <text x={map.width - 20} y={24} fontSize={13} textAnchor="middle" fill="#1f2430">
          N
        </text>
      </g>
    </svg>
  );
}
