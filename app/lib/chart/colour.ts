// Text on the standard chart colours: black or white, whichever contrasts more (WCAG 2.2
// relative luminance). Black and white meet at a luminance of about 0.18, where each gives 4.58:1,
// so every label on every chart colour reaches at least 4.5:1 (the site's ink, #1f2430, would not:
// the Ordovician green gets 3.95:1 with ink and with white).

export const INK = "#1f2430";
export const BLACK = "#000000";
export const WHITE = "#ffffff";

function channel(c: number): number {
  const s = c / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}

export function luminance(hex: string): number {
  const m = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) return 1;
  const [r, g, b] = [m[1], m[2], m[3]].map((h) => parseInt(h, 16));
  return 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
}

export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** Black or white on this background, whichever has the higher contrast ratio (always ≥ 4.58:1). */
export function textOn(background: string): string {
  return contrastRatio(background, BLACK) >= contrastRatio(background, WHITE) ? BLACK : WHITE;
}
