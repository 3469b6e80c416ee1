// The route's slope profile under the route plan: elevation along the route (smoothed as the
// profile states), stretches over 5 % shaded, those breaking an ABA §1017 limit hatched as well as
// orange (colour is never the only cue), with the flagged stretches listed in words beside the
// trailhead facts. Computed in the browser from the route's own elevations (app/lib/profile).
import { useMemo } from "react";
import { AxisBottom, AxisLeft } from "@visx/axis";
import { Group } from "@visx/group";
import { scaleLinear } from "@visx/scale";
import { LinePath } from "@visx/shape";
import type { LineStringGeometry, UnitsPreference } from "~/lib/exhibit/types";
import { formatLength } from "~/lib/exhibit/display";
import { formatLengthReadable } from "~/lib/scale/format";
import { FLAG_COLOUR, STEEP_COLOUR } from "~/lib/profile/chart";
import { routeProfile } from "~/lib/profile/profile";
import { NO_ELEVATIONS, PLANNING_CAUTION } from "~/lib/profile/trailhead";
import { useWidth } from "./use-width";

const H = 180;
const M = { top: 10, right: 12, bottom: 34, left: 52 };

export function ProfileChart({ geometry, units }: { geometry: LineStringGeometry; units: UnitsPreference }) {
  const profile = useMemo(() => routeProfile(geometry.coordinates as number[][]), [geometry]);
  const [ref, width] = useWidth<HTMLDivElement>(640);
  if (!profile) {
    return (
      <div className="mt-4 font-sans text-sm" data-testid="profile-none">
        <h3 className="text-base font-semibold">Slope profile</h3>
        <p className="text-ink-soft">{NO_ELEVATIONS}</p>
      </div>
    );
  }
  const W = Math.max(280, width || 640);
  const x = scaleLinear({ domain: [0, profile.totals.lengthMetres], range: [0, W - M.left - M.right] });
  const lo = Math.floor(profile.totals.minElevationMetres / 5) * 5;
  const y = scaleLinear({ domain: [lo, Math.max(lo + 10, Math.ceil(profile.totals.maxElevationMetres / 5) * 5)], range: [H - M.top - M.bottom, 0], nice: true });
  const flagged = profile.stretches.filter((s) => s.rule);
  const t = profile.totals;
  const pct = (v: number) => `${v.toFixed(1)} %`;
  return (
    <div className="mt-4 font-sans text-sm" ref={ref} data-testid="profile-chart">
      <h3 className="text-base font-semibold">Slope profile</h3>
      <svg width={W} height={H} role="img" aria-labelledby="profile-title" className="block max-w-full">
        <title id="profile-title">{`Elevation along the route: up ${formatLength(t.ascentMetres, units, 1)}, down ${formatLength(t.descentMetres, units, 1)}; ${flagged.length} stretch${flagged.length === 1 ? "" : "es"} over the ABA limits`}</title>
        <defs>
          <pattern id="aba-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="6" height="6" fill={FLAG_COLOUR} />
            <line x1="0" y1="0" x2="0" y2="6" stroke="#1a1a1a" strokeWidth="1.5" />
          </pattern>
        </defs>
        <Group left={M.left} top={M.top}>
          {profile.stretches.map((s) => (
            <rect key={s.fromMetres} x={x(s.fromMetres)} y={0} width={Math.max(2, x(s.toMetres) - x(s.fromMetres))} height={H - M.top - M.bottom} fill={s.rule ? "url(#aba-hatch)" : STEEP_COLOUR} data-flagged={s.rule ? "yes" : "no"} />
          ))}
          <LinePath data={profile.samples} x={(d) => x(d.distanceMetres)} y={(d) => y(d.smoothedMetres)} stroke="#1f4e79" strokeWidth={2} />
          <AxisLeft scale={y} numTicks={4} tickFormat={(v) => formatLength(Number(v), units, 1)} tickLabelProps={{ fontSize: 12, fill: "#1f2430" }} />
          <AxisBottom top={H - M.top - M.bottom} scale={x} numTicks={Math.max(2, Math.floor(W / 110))} tickFormat={(v) => formatLengthReadable(Number(v), 3, units)} tickLabelProps={{ fontSize: 12, fill: "#1f2430" }} />
        </Group>
      </svg>
      <p className="mt-2">
        Up {formatLength(t.ascentMetres, units, 1)}, down {formatLength(t.descentMetres, units, 1)}; typical running slope {pct(t.typicalSlopePercent)}, steepest {pct(t.maxSlopePercent)}.
        {flagged.length === 0 ? " No stretch over the ABA §1017 limits at this resolution." : null}
      </p>
      {flagged.length > 0 ? (
        <ul className="mt-1 list-disc pl-5">
          {flagged.map((s) => (
            <li key={s.fromMetres}>
              <span className="inline-block h-3 w-3 align-middle" style={{ background: "repeating-linear-gradient(45deg, #e67e22 0 3px, #1a1a1a 3px 4.5px)" }} aria-hidden="true" /> {formatLengthReadable(s.fromMetres, 3, units)}–{formatLengthReadable(s.toMetres, 3, units)}: {s.direction} {pct(Math.abs(s.runningSlopePercent))} (steepest {pct(s.maxSlopePercent)}) — {s.rule}; rest at the top and bottom.
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-1 text-ink-soft">{profile.method.text} {PLANNING_CAUTION}</p>
    </div>
  );
}
