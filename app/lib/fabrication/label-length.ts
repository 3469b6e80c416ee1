// Label-length guidance for sign text (Smithsonian Guidelines for Accessible Exhibition Design [v]):
// sentences of at most 25 words (15 preferred), labels of at most 75–100 words, lines of at most 55
// characters (45–50 preferred). Pure; the text is plain (Markdown and HTML already removed).
import { FABRICATION_SOURCES } from "./sources";

export const LABEL_LIMITS = { sentenceWords: 25, sentenceWordsPreferred: 15, labelWords: 100, labelWordsPreferred: 75, lineChars: 55, lineCharsPreferred: 50 } as const;

export interface LengthCheck {
  words: number;
  sentences: number;
  longestSentenceWords: number;
  warnings: string[];
}

/** Plain text of a marker's Markdown: no markup, links as their words, one space between words. */
export function plainText(markdown: string): string {
  return markdown
    .replace(/<[^>]*>/g, " ")
    .replace(/!\[[^\]]*\]\([^)]*\)/g, " ")
    .replace(/\[([^\]]*)\]\([^)]*\)/g, "$1")
    .replace(/^\s{0,3}(#{1,6}|>|[-*+]|\d+\.)\s+/gm, "")
    .replace(/[*_`~]+/g, "")
    .replace(/&nbsp;/g, " ")
    .replace(/&amp;/g, "&")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/\s+/g, " ")
    .trim();
}

const words = (s: string) => s.split(/\s+/).filter((w) => /[\p{L}\p{N}]/u.test(w)).length;

/** Sentences end at . ! ? followed by a space and a capital or a digit (so "4.5 Ma" and "c. 3" stay whole). */
export function sentencesOf(text: string): string[] {
  return text
    .split(/(?<=[.!?])\s+(?=[\p{Lu}\p{N}"“(])/u)
    .map((s) => s.trim())
    .filter((s) => words(s) > 0);
}

export function checkLabelLength(text: string, name: string): LengthCheck {
  const sentences = sentencesOf(text);
  const counts = sentences.map(words);
  const total = words(text);
  const longest = counts.reduce((a, b) => Math.max(a, b), 0);
  const warnings: string[] = [];
  const source = FABRICATION_SOURCES.labelLength;
  if (longest > LABEL_LIMITS.sentenceWords) warnings.push(`${name}: a sentence of ${longest} words (guidance: at most ${LABEL_LIMITS.sentenceWords}, ${LABEL_LIMITS.sentenceWordsPreferred} preferred; ${source}).`);
  if (total > LABEL_LIMITS.labelWords) warnings.push(`${name}: ${total} words (guidance: at most ${LABEL_LIMITS.labelWordsPreferred}–${LABEL_LIMITS.labelWords} words a label; ${source}).`);
  return { words: total, sentences: sentences.length, longestSentenceWords: longest, warnings };
}
