// Web addresses made from names: the one slug rule of Eonscale (exhibits, dated events).
import transliterate from "@sindresorhus/transliterate";

/** Lower-case letters and digits in groups joined by single hyphens, like riverside-walk. */
export const SLUG_PATTERN = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/** FNV-1a (32 bit) of the text in base 36: a short stable id for names no script rule can spell. */
function shortId(text: string): string {
  let h = 0x811c9dc5;
  for (const ch of text) {
    h ^= ch.codePointAt(0)!;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(36).padStart(7, "0");
}

/**
 * A slug from a title or name in any script, at most `maxLength` characters: transliterated to
 * Latin (@sindresorhus/transliterate: "Зачелмие" → "zachelmie", "Ζάκυνθος" → "zakynthos"), accents
 * dropped ("End-Permian mass extinction (Meishan)" → "end-permian-mass-extinction-meishan").
 * A name whose letters have no Latin spelling there (Japanese, Chinese: "付加体の年代") gets
 * `${fallback}-<id>`, the id a short hash of the name, so the slug is never empty. Empty only when
 * the text has no letters or digits at all.
 */
export function slugify(text: string, maxLength = 100, fallback = "item"): string {
  const slug = transliterate(text.normalize("NFC"))
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[łđøæœß]/g, (c) => ({ ł: "l", đ: "d", ø: "o", æ: "ae", œ: "oe", ß: "ss" })[c] ?? c)
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, maxLength)
    .replace(/-+$/, "");
  if (slug !== "" || !/[\p{L}\p{N}]/u.test(text)) return slug;
  return `${fallback}-${shortId(text.normalize("NFC").trim())}`.slice(0, maxLength);
}
