// Which language a visitor page speaks. Interval names come in the languages the chart edition
// carries (the ICS chart's own translations, `edition.languages` in the snapshot); the page's own
// words come from one translation file per language (app/locales), English when there is none.
// A `?lang=xx` link wins over the browser's Accept-Language (RFC 9110 §12.5.4 q-values; a tag
// matches itself, then its primary subtag: "de-AT" → "de", "pt-PT" → "pt").

export const DEFAULT_LANGUAGE = "en";

/** Names of the languages in themselves, for the language switcher (common practice spellings). */
const AUTONYMS: Record<string, string> = {
  az: "Azərbaycan dili",
  ca: "Català",
  cs: "Čeština",
  de: "Deutsch",
  en: "English",
  es: "Español",
  "es-a": "Español (es-a)",
  eu: "Euskara",
  fi: "Suomi",
  fr: "Français",
  hu: "Magyar",
  id: "Bahasa Indonesia",
  it: "Italiano",
  ja: "日本語",
  ko: "한국어",
  lt: "Lietuvių",
  nl: "Nederlands",
  "nl-be": "Nederlands (België)",
  no: "Norsk",
  pl: "Polski",
  pt: "Português",
  "pt-br": "Português (Brasil)",
  ru: "Русский",
  sk: "Slovenčina",
  tr: "Türkçe",
  zh: "中文",
};

export function autonym(tag: string): string {
  return AUTONYMS[tag] ?? tag;
}

/** Accept-Language as [tag, q] pairs, best first; malformed entries are skipped. */
export function parseAcceptLanguage(header: string | null | undefined): { tag: string; q: number }[] {
  if (!header) return [];
  const out: { tag: string; q: number; i: number }[] = [];
  header
    .split(",")
    .slice(0, 32)
    .forEach((part, i) => {
      const [rawTag, ...params] = part.trim().split(";");
      const tag = rawTag.trim().toLowerCase();
      if (!/^(\*|[a-z]{1,8}(-[a-z0-9]{1,8})*)$/.test(tag)) return;
      let q = 1;
      for (const p of params) {
        const m = /^\s*q\s*=\s*([01](\.\d{0,3})?)\s*$/i.exec(p);
        if (m) q = Number(m[1]);
      }
      if (q > 0 && q <= 1) out.push({ tag, q, i });
    });
  return out.sort((a, b) => b.q - a.q || a.i - b.i).map(({ tag, q }) => ({ tag, q }));
}

/** The available tag a requested tag stands for, or null ("de-at" → "de"; "pt-br" stays "pt-br" when offered). */
export function matchTag(requested: string, available: readonly string[]): string | null {
  const want = requested.toLowerCase();
  if (available.includes(want)) return want;
  const primary = want.split("-")[0];
  if (available.includes(primary)) return primary;
  return null;
}

/**
 * The page language: `?lang=` when it names an available language, else the best Accept-Language
 * match, else English. `available` is the edition's language list (always holds "en").
 */
export function negotiateLanguage(query: string | null | undefined, acceptLanguage: string | null | undefined, available: readonly string[]): string {
  if (query) {
    const hit = matchTag(query, available);
    if (hit) return hit;
  }
  for (const { tag } of parseAcceptLanguage(acceptLanguage)) {
    if (tag === "*") break;
    const hit = matchTag(tag, available);
    if (hit) return hit;
  }
  return available.includes(DEFAULT_LANGUAGE) ? DEFAULT_LANGUAGE : (available[0] ?? DEFAULT_LANGUAGE);
}
