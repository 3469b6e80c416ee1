// Web addresses made from names: the one slug rule of Eonscale (exhibits, dated events).

/** Lower-case letters and digits in groups joined by single hyphens, like riverside-walk. */
export const SLUG_PATTERN = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/**
 * A slug from a title or name, at most `maxLength` characters: accents dropped, letters without a
 * decomposition spelled out ("End-Permian mass extinction (Meishan)" → "end-permian-mass-extinction-meishan",
 * "Zachełmie" → "zachelmie"). Empty when the text has no letters or digits.
 */
export function slugify(text: string, maxLength = 100): string {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[łđøæœß]/g, (c) => ({ ł: "l", đ: "d", ø: "o", æ: "ae", œ: "oe", ß: "ss" })[c] ?? c)
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, maxLength)
    .replace(/-+$/, "");
}
