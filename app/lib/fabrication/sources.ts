// The practice figures the fabrication files use, each with its source (see DESIGN.md, "Published
// practice figures"): [v] read in the source's own text, [q] seen quoted, [r] from memory; "common
// practice" for a trade habit with no standard behind it. Every sheet prints the ones it applied.

export const FABRICATION_SOURCES = {
  ada: "ADA 2010 Standards §703.5.5 (visual character height by baseline height and viewing distance) [v]",
  adaMounting: "ADA 2010 Standards §703.5.6: visual characters at least 1015 mm (40 in) above the floor [r, from memory]",
  xHeight: "Parks Canada table, quoted in the Smithsonian Guidelines for Accessible Exhibition Design: x-height ≥ 4.5 mm; 9 mm at 1 m, 19 mm at 2 m, 28 mm at 3 m [q]",
  nps24pt: "US National Park Service exhibit typography: no text under 24 pt [v]",
  labelLength: "Smithsonian Guidelines for Accessible Exhibition Design: sentences ≤ 25 words (15 preferred), labels ≤ 75–100 words, lines ≤ 55 characters (45–50 preferred) [v]",
  wallLabelHeight: "wall label centre 1370 mm above the floor, comfortable 1220–1675 mm [q]",
  wayside: "NPS wayside panels: low-profile frame bottom 30 in (762 mm) above grade; no white backgrounds [v]",
  contrast: "WCAG 2.2 §1.4.3: text contrast at least 4.5:1 [v]",
  qrQuietZone: "ISO/IEC 18004: quiet zone of 4 modules on every side; error correction Q (25 %) or H (30 %) outdoors [v via the maker's page]",
  qrSize: "rule of thumb, not a standard: code width ≥ 1/10 of the scanning distance, modules ≥ 0.5 mm",
  rolls: "common roll widths 24, 36, 44 in [v]; 54, 60, 64 in [r, from memory]; there are no standard roll widths (FESPA, 2018) [v]",
  overlap: "tile overlap about 20 mm: one large-format printer's default [v]",
  bleed: "3 mm bleed: common practice [r, from memory]; some printers ask for ≥ 1/4 in, 1 in for murals [v]",
  aba: "US Access Board ABA Standards §1017 (trails): running slope ≤ 5 % any length; ≤ 8.33 % for ≤ 61 m; ≤ 10 % for ≤ 9 m; ≤ 12.5 % for ≤ 3 m; no more than 30 % of the length over 8.33 %; resting intervals at the top and bottom of segments over 5 % [v]",
  gpsHeights: "consumer GPS heights err by several metres (common practice, from memory); slopes over a few metres cannot be read from them",
  walking: "FHWA-RD-98-107: 1.2 m/s design walking speed [v]; MUTCD §4E.06: 0.9 m/s (3 ft/s) slower-walker check [q]",
  waysideSize: "wayside panel 36 × 24 in (914 × 610 mm) [r, from memory]",
} as const;

export type FabricationSource = keyof typeof FABRICATION_SOURCES;

/** 1 in = 25.4 mm exactly; 1 pt = 1/72 in (PDF user space). */
export const MM_PER_INCH = 25.4;
export const POINTS_PER_MM = 72 / MM_PER_INCH;
