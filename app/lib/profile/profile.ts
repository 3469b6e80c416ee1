// The slope profile of a route from the elevations of its track. Method (stated in every output):
// elevations are resampled every `sampleMetres` along the route by linear interpolation between
// vertices, smoothed by a centred moving average over `windowMetres` (consumer GPS heights err by
// metres, so the slope over a few metres is noise), and the running slope of each sample step is
// the rise of the smoothed elevations over its length. Stretches are judged against the US Access
// Board ABA Standards §1017 running-slope limits only where the data can resolve them: a stretch
// counts against a limit when it is at least as long as the smoothing window; shorter ones are
// noted as needing a site survey. Pure.
import { prepareRoute } from "../geo/route";

export const PROFILE_DEFAULTS = { sampleMetres: 5, windowMetres: 30 } as const;

/** ABA §1017 running slope: steeper than `overPercent` is allowed for at most `maxMetres` (null: not at all). */
export const ABA_LIMITS = [
  { id: "aba-12.5", overPercent: 12.5, maxMetres: 0, text: "ABA §1017: never steeper than 12.5 %" },
  { id: "aba-10-3m", overPercent: 10, maxMetres: 3, text: "ABA §1017: steeper than 10 % for at most 3 m" },
  { id: "aba-8.33-9m", overPercent: 100 / 12, maxMetres: 9, text: "ABA §1017: steeper than 8.33 % for at most 9 m" },
  { id: "aba-5-61m", overPercent: 5, maxMetres: 61, text: "ABA §1017: steeper than 5 % for at most 61 m" },
] as const;
export const ABA_SHARE_LIMIT = { id: "aba-30-percent", overPercent: 100 / 12, maxShare: 0.3, text: "ABA §1017: no more than 30 % of the trail's length steeper than 8.33 %" } as const;

export interface ProfileOptions {
  sampleMetres: number;
  windowMetres: number;
}

export interface ProfileSample {
  distanceMetres: number;
  /** Interpolated from the track. */
  elevationMetres: number;
  smoothedMetres: number;
  /** Running slope of the step from this sample to the next, percent (signed: + uphill); 0 at the last sample. */
  slopePercent: number;
}

export interface RestingPoint {
  at: "bottom" | "top";
  distanceMetres: number;
  elevationMetres: number;
}

export interface Stretch {
  fromMetres: number;
  toMetres: number;
  lengthMetres: number;
  /** Rise over run of the whole stretch, percent (signed). */
  runningSlopePercent: number;
  /** Steepest step, percent (absolute). */
  maxSlopePercent: number;
  direction: "up" | "down";
  /** The most severe ABA rule the stretch breaks, in words; null when it keeps every limit the data can check. */
  rule: string | null;
  ruleId: string | null;
  /** Every rule it breaks. */
  rules: { id: string; text: string; overMetres: number }[];
  /** Steeper bits too short to resolve from GPS heights (they need a site survey). */
  unresolved: string[];
  restingPoints: RestingPoint[];
}

export interface ProfileTotals {
  lengthMetres: number;
  ascentMetres: number;
  descentMetres: number;
  minElevationMetres: number;
  maxElevationMetres: number;
  /** Length-weighted median of the absolute running slope, percent. */
  typicalSlopePercent: number;
  maxSlopePercent: number;
  over833Metres: number;
  over833Percent: number;
  /** The 30 % rule when broken, else null. */
  rule: string | null;
}

export interface SlopeProfile {
  method: { text: string; sampleMetres: number; windowMetres: number; resolutionMetres: number };
  samples: ProfileSample[];
  stretches: Stretch[];
  totals: ProfileTotals;
  notes: string[];
}

const r2 = (x: number) => Math.round(x * 100) / 100;

/** Linear interpolation of elevations at each distance (both lists ascending). */
function resample(distances: ArrayLike<number>, elevations: ArrayLike<number>, at: number[]): number[] {
  const out: number[] = [];
  let j = 0;
  for (const d of at) {
    while (j < distances.length - 2 && distances[j + 1] < d) j++;
    const d0 = distances[j];
    const d1 = distances[Math.min(j + 1, distances.length - 1)];
    const t = d1 > d0 ? Math.min(1, Math.max(0, (d - d0) / (d1 - d0))) : 0;
    out.push(elevations[j] + t * (elevations[Math.min(j + 1, elevations.length - 1)] - elevations[j]));
  }
  return out;
}

/**
 * Centred moving average over a window: the mean of the (piecewise linear) resampled profile over
 * [d − window/2, d + window/2], clipped at the ends of the route — an integral mean, so noise that
 * alternates from sample to sample cancels instead of leaving a ripple.
 */
function movingAverage(at: number[], values: number[], windowMetres: number): number[] {
  const area = [0];
  for (let i = 1; i < at.length; i++) area.push(area[i - 1] + ((values[i - 1] + values[i]) / 2) * (at[i] - at[i - 1]));
  const areaAt = (x: number) => {
    let lo = 0;
    let hi = at.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (at[mid] <= x) lo = mid;
      else hi = mid;
    }
    const span = at[hi] - at[lo];
    const t = span > 0 ? Math.min(1, Math.max(0, (x - at[lo]) / span)) : 0;
    const v = values[lo] + t * (values[hi] - values[lo]);
    return area[lo] + ((values[lo] + v) / 2) * (x - at[lo]);
  };
  const total = at[at.length - 1];
  return at.map((d, i) => {
    const x0 = Math.max(0, d - windowMetres / 2);
    const x1 = Math.min(total, d + windowMetres / 2);
    return x1 > x0 ? (areaAt(x1) - areaAt(x0)) / (x1 - x0) : values[i];
  });
}

/** The profile from distances along the route (metres, ascending from 0) and elevations (metres). */
export function slopeProfileOf(distances: ArrayLike<number>, elevations: ArrayLike<number>, options: ProfileOptions = PROFILE_DEFAULTS): SlopeProfile {
  const { sampleMetres: step, windowMetres: window } = options;
  const total = distances[distances.length - 1];
  const at: number[] = [];
  for (let k = 0; k * step < total - 1e-9; k++) at.push(k * step);
  at.push(total);
  const raw = resample(distances, elevations, at);
  const smooth = window > step ? movingAverage(at, raw, window) : raw;
  const slopes = at.map((d, i) => (i < at.length - 1 ? ((smooth[i + 1] - smooth[i]) / (at[i + 1] - d)) * 100 : 0));
  const samples = at.map((d, i) => ({ distanceMetres: r2(d), elevationMetres: r2(raw[i]), smoothedMetres: r2(smooth[i]), slopePercent: r2(slopes[i]) }));
  const resolution = Math.max(window, step);
  const stretches = findStretches(at, smooth, slopes, resolution);

  let ascent = 0;
  let descent = 0;
  let over = 0;
  const steps: { len: number; slope: number }[] = [];
  for (let i = 0; i < at.length - 1; i++) {
    const rise = smooth[i + 1] - smooth[i];
    if (rise > 0) ascent += rise;
    else descent -= rise;
    const len = at[i + 1] - at[i];
    if (Math.abs(slopes[i]) > ABA_SHARE_LIMIT.overPercent + 1e-9) over += len;
    steps.push({ len, slope: Math.abs(slopes[i]) });
  }
  steps.sort((a, b) => a.slope - b.slope);
  let acc = 0;
  const typical = steps.find((s) => (acc += s.len) >= total / 2)?.slope ?? 0;
  const share = total > 0 ? over / total : 0;
  const notes = [
    `Planning aid from GPS data: slopes are read at a resolution of about ${resolution} m; the 3 m and 9 m limits of ABA §1017, cross slope and tread width need a site survey, and this does not replace a trail assessment under local codes.`,
  ];
  const unresolvedCount = stretches.reduce((n, s) => n + s.unresolved.length, 0);
  if (unresolvedCount) notes.push(`${unresolvedCount} steeper bit${unresolvedCount === 1 ? " is" : "s are"} shorter than the ${resolution} m resolution: check ${unresolvedCount === 1 ? "it" : "them"} on site.`);
  return {
    method: {
      text: `Elevations resampled every ${step} m along the route (linear between track points), smoothed by a centred moving average over ${window} m; running slope = rise of the smoothed elevations over each ${step} m step. Stretches shorter than ${resolution} m are not judged.`,
      sampleMetres: step,
      windowMetres: window,
      resolutionMetres: resolution,
    },
    samples,
    stretches,
    totals: {
      lengthMetres: r2(total),
      ascentMetres: r2(ascent),
      descentMetres: r2(descent),
      minElevationMetres: r2(Math.min(...smooth)),
      maxElevationMetres: r2(Math.max(...smooth)),
      typicalSlopePercent: r2(typical),
      maxSlopePercent: r2(Math.max(0, ...steps.map((s) => s.slope))),
      over833Metres: r2(over),
      over833Percent: r2(share * 100),
      rule: share > ABA_SHARE_LIMIT.maxShare && over >= resolution ? ABA_SHARE_LIMIT.text : null,
    },
    notes,
  };
}

/** Maximal runs of steps with |slope| over `limit` % and one sign: [start index, end index) pairs. */
function runs(slopes: number[], limit: number, from: number, to: number): [number, number][] {
  const out: [number, number][] = [];
  let i = from;
  while (i < to) {
    if (Math.abs(slopes[i]) <= limit + 1e-9) {
      i++;
      continue;
    }
    const sign = Math.sign(slopes[i]);
    const start = i;
    while (i < to && Math.abs(slopes[i]) > limit + 1e-9 && Math.sign(slopes[i]) === sign) i++;
    out.push([start, i]);
  }
  return out;
}

function findStretches(at: number[], smooth: number[], slopes: number[], resolution: number): Stretch[] {
  const last = at.length - 1;
  return runs(slopes, 5, 0, last).map(([a, b]) => {
    const from = at[a];
    const to = at[b];
    const rules: Stretch["rules"] = [];
    const unresolved: string[] = [];
    for (const limit of ABA_LIMITS) {
      for (const [c, d] of runs(slopes, limit.overPercent, a, b)) {
        const len = at[d] - at[c];
        if (len <= limit.maxMetres + 1e-9) continue;
        if (len + 1e-9 >= resolution) {
          if (!rules.some((x) => x.id === limit.id)) rules.push({ id: limit.id, text: limit.text, overMetres: r2(len) });
        } else unresolved.push(`${r2(len)} m steeper than ${r2(limit.overPercent)} % at ${r2(at[c])} m (below the ${resolution} m resolution)`);
      }
    }
    const direction = smooth[b] >= smooth[a] ? "up" : "down";
    const [bottom, top] = direction === "up" ? [a, b] : [b, a];
    return {
      fromMetres: r2(from),
      toMetres: r2(to),
      lengthMetres: r2(to - from),
      runningSlopePercent: r2(((smooth[b] - smooth[a]) / (to - from)) * 100),
      maxSlopePercent: r2(Math.max(...slopes.slice(a, b).map(Math.abs))),
      direction,
      rule: rules[0]?.text ?? null,
      ruleId: rules[0]?.id ?? null,
      rules,
      unresolved,
      restingPoints: [
        { at: "bottom" as const, distanceMetres: r2(at[bottom]), elevationMetres: r2(smooth[bottom]) },
        { at: "top" as const, distanceMetres: r2(at[top]), elevationMetres: r2(smooth[top]) },
      ].sort((p, q) => p.distanceMetres - q.distanceMetres),
    };
  });
}

/** The profile of a route given as [lon, lat, elevation] vertices (geodesic distances on WGS84). */
export function routeProfile(coordinates: readonly number[][], options: ProfileOptions = PROFILE_DEFAULTS): SlopeProfile | null {
  if (coordinates.length < 2 || coordinates.some((c) => c.length < 3 || !Number.isFinite(c[2]))) return null;
  const route = prepareRoute(coordinates.flatMap((c) => [c[0], c[1]]));
  return slopeProfileOf(route.cumulative, coordinates.map((c) => c[2]), options);
}
