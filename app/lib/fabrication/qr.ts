// The printed size of a sign's QR code. Rule of thumb (not a standard): the code is at least a
// tenth of the scanning distance wide and each module at least 0.5 mm; ISO/IEC 18004 asks for a
// quiet zone of 4 modules on every side. Pure: millimetres.
export const QR_QUIET_ZONE_MODULES = 4;
export const QR_MIN_MODULE_MM = 0.5;
export const QR_DISTANCE_RATIO = 10;

export interface QrSize {
  /** Module size, mm. */
  moduleMm: number;
  /** The symbol without its quiet zone, mm. */
  symbolMm: number;
  /** The symbol with the quiet zone on both sides, mm. */
  totalMm: number;
  text: string;
}

/** Smallest printed code for `modules` modules per side scanned from `distanceMm`. */
export function qrSize(modules: number, distanceMm: number): QrSize {
  const byDistance = distanceMm / QR_DISTANCE_RATIO;
  const moduleMm = Math.max(QR_MIN_MODULE_MM, byDistance / modules);
  const symbolMm = moduleMm * modules;
  const totalMm = moduleMm * (modules + 2 * QR_QUIET_ZONE_MODULES);
  const rule = byDistance / modules >= QR_MIN_MODULE_MM ? `1/10 of ${Math.round(distanceMm)} mm scanning distance` : `modules of at least ${QR_MIN_MODULE_MM} mm`;
  return {
    moduleMm,
    symbolMm,
    totalMm,
    text: `QR code ${symbolMm.toFixed(1)} mm wide (${modules} modules of ${moduleMm.toFixed(2)} mm; ${rule}), plus a ${QR_QUIET_ZONE_MODULES}-module quiet zone: ${totalMm.toFixed(1)} mm`,
  };
}

/** Runs of dark modules per row, for drawing a code with few rectangles. */
export function qrRuns(size: number, dark: (row: number, col: number) => boolean): { row: number; col: number; length: number }[] {
  const runs: { row: number; col: number; length: number }[] = [];
  for (let r = 0; r < size; r++) {
    let c = 0;
    while (c < size) {
      if (!dark(r, c)) {
        c++;
        continue;
      }
      const start = c;
      while (c < size && dark(r, c)) c++;
      runs.push({ row: r, col: start, length: c - start });
    }
  }
  return runs;
}
