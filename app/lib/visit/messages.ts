// The interface words of the visitor pages, one file per language in app/locales. English is
// complete by definition; every other file must hold every key (tests/unit/visit/messages.test.ts).
// Placeholders are written {name} and filled by `fill`.
import de from "../../locales/de.json";
import en from "../../locales/en.json";

export type Messages = typeof en;
export type MessageKey = keyof Messages;

const CATALOGUES: Record<string, Messages> = { en, de };

/** Languages with a translation of the interface words. */
export const INTERFACE_LANGUAGES = Object.keys(CATALOGUES);

/** The interface language for a page language: its own catalogue, or English. */
export function interfaceLanguage(lang: string): string {
  const primary = lang.split("-")[0];
  return CATALOGUES[lang] ? lang : CATALOGUES[primary] ? primary : "en";
}

export function messagesFor(lang: string): Messages {
  return CATALOGUES[interfaceLanguage(lang)];
}

/** "{n} min" + { n: 5 } → "5 min". Unknown placeholders stay as written. */
export function fill(template: string, values: Record<string, string | number>): string {
  return template.replace(/\{(\w+)\}/g, (whole, key: string) => (key in values ? String(values[key]) : whole));
}

// Numbers stay in the snapshot's own style (1,234.5) in every language: the published figures are
// fixed display strings, and mixing "4.031 Ga" with "1.234 m" in one page would mislead.
