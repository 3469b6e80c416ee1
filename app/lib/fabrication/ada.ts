// Minimum character heights for sign text. Two published figures, applied together:
// - ADA 2010 Standards §703.5.5 (Table 703.5.5): the minimum height of uppercase letters by the
//   height of the baseline above the floor and the viewing distance;
// - the Parks Canada x-height table (quoted in the Smithsonian Guidelines for Accessible Exhibition
//   Design) for running text: x-height at least 4.5 mm, 9 mm at 1 m, 19 mm at 2 m, 28 mm at 3 m.
// Pure: lengths in millimetres.
import { FABRICATION_SOURCES } from "./sources";

export interface AdaRow {
  /** Baseline above the floor, exclusive lower and inclusive upper bound, mm (upper null: no limit). */
  baselineAboveMm: number;
  baselineUpToMm: number | null;
  /** Below this viewing distance the base height applies; beyond it 3.2 mm is added per 305 mm. */
  distanceBelowMm: number;
  minHeightMm: number;
  /** How the row is written in the standard. */
  text: string;
}

/** Table 703.5.5, metric figures as the standard prints them. */
export const ADA_TABLE: readonly AdaRow[] = [
  { baselineAboveMm: 1015, baselineUpToMm: 1780, distanceBelowMm: 1830, minHeightMm: 16, text: "baseline 1015–1780 mm (40–70 in): 16 mm (5/8 in) read from under 1830 mm (72 in)" },
  { baselineAboveMm: 1780, baselineUpToMm: 3050, distanceBelowMm: 4570, minHeightMm: 51, text: "baseline 1780–3050 mm (70–120 in): 51 mm (2 in) read from under 4570 mm (15 ft)" },
  { baselineAboveMm: 3050, baselineUpToMm: null, distanceBelowMm: 6400, minHeightMm: 75, text: "baseline above 3050 mm (120 in): 75 mm (3 in) read from under 6400 mm (21 ft)" },
];

/** "plus 3.2 mm (1/8 in) per 305 mm (1 ft) of viewing distance" beyond the row's distance. */
export const ADA_EXTRA_MM_PER_305 = 3.2;

export interface CharacterRule {
  /** Minimum uppercase height, mm. */
  heightMm: number;
  /** The row used and the arithmetic, in words. */
  text: string;
  notes: string[];
}

function fmt(x: number) {
  return Number(x.toFixed(1)).toString();
}

/**
 * The ADA minimum uppercase height for a baseline `baselineMm` above the floor read from
 * `distanceMm`. Beyond the row's distance the height grows by 3.2 mm per 305 mm, in proportion
 * (the standard says "per foot"; we do not round the distance to whole feet). A baseline below
 * 1015 mm is outside the table: the first row is applied and a note says so.
 */
export function adaMinimumHeight(baselineMm: number, distanceMm: number): CharacterRule {
  const notes: string[] = [];
  let row = ADA_TABLE.find((r) => baselineMm > r.baselineAboveMm && (r.baselineUpToMm === null || baselineMm <= r.baselineUpToMm));
  if (baselineMm === ADA_TABLE[0].baselineAboveMm) row = ADA_TABLE[0];
  if (!row) {
    row = ADA_TABLE[0];
    notes.push(`A baseline ${fmt(baselineMm)} mm above the floor is below the table, which starts at 1015 mm (40 in) (${FABRICATION_SOURCES.adaMounting}); the first row is applied.`);
  }
  const beyond = Math.max(0, distanceMm - row.distanceBelowMm);
  const heightMm = row.minHeightMm + (ADA_EXTRA_MM_PER_305 * beyond) / 305;
  const text =
    beyond > 0
      ? `ADA §703.5.5, ${row.text}; read from ${fmt(distanceMm)} mm: ${row.minHeightMm} + 3.2 × ${fmt(beyond)} / 305 = ${fmt(heightMm)} mm`
      : `ADA §703.5.5, ${row.text}: ${row.minHeightMm} mm`;
  return { heightMm, text, notes };
}

/** The Parks Canada points: viewing distance (mm) → minimum x-height (mm). */
export const X_HEIGHT_TABLE: readonly [number, number][] = [
  [1000, 9],
  [2000, 19],
  [3000, 28],
];
export const X_HEIGHT_FLOOR_MM = 4.5;

/**
 * Minimum x-height of running text read from `distanceMm`: straight lines between the table's
 * points, in proportion to the distance below 1 m (never under 4.5 mm), and along the last slope
 * (9 mm per metre) beyond 3 m — an extrapolation, said in the text.
 */
export function minimumXHeight(distanceMm: number): CharacterRule {
  const t = X_HEIGHT_TABLE;
  let h: number;
  let how: string;
  if (distanceMm <= t[0][0]) {
    h = (t[0][1] * distanceMm) / t[0][0];
    how = `in proportion below 1 m`;
  } else if (distanceMm >= t[t.length - 1][0]) {
    const [[d1, h1], [d2, h2]] = [t[t.length - 2], t[t.length - 1]];
    h = h2 + ((h2 - h1) / (d2 - d1)) * (distanceMm - d2);
    how = distanceMm > d2 ? `extrapolated beyond 3 m at ${fmt(((h2 - h1) / (d2 - d1)) * 1000)} mm per metre` : `at 3 m`;
  } else {
    const i = t.findIndex(([d]) => d >= distanceMm);
    const [[d1, h1], [d2, h2]] = [t[i - 1], t[i]];
    h = h1 + ((h2 - h1) * (distanceMm - d1)) / (d2 - d1);
    how = `between ${d1 / 1000} m and ${d2 / 1000} m`;
  }
  const floored = Math.max(X_HEIGHT_FLOOR_MM, h);
  return {
    heightMm: floored,
    text: `x-height table (Parks Canada, via the Smithsonian guidelines), read from ${fmt(distanceMm)} mm, ${how}: ${fmt(floored)} mm${floored > h ? " (the 4.5 mm floor)" : ""}`,
    notes: [],
  };
}

/** 1 pt = 25.4/72 mm; the NPS floor of 24 pt as a font size in mm. */
export const NPS_MIN_FONT_MM = (24 * 25.4) / 72;
