// Intervals ↔ JSON: the same content as the CSV, as an array of Interval objects.
// parseJson() also accepts an edition file ({ edition, intervals }). Problems carry the array
// index (0-based) in `line`.

import { check } from "./check";
import type { ImportOptions } from "./csv";
import { validateInterval } from "./schema";
import type { Interval, ParseResult, Problem } from "./types";

/** An interval's public fields, in the order every JSON the product writes keeps them. */
export function intervalFields(iv: Interval) {
  return {
    name: iv.name,
    rank: iv.rank,
    parent: iv.parent,
    baseMa: iv.baseMa,
    baseUncertaintyMa: iv.baseUncertaintyMa,
    topMa: iv.topMa,
    color: iv.color,
    gssp: iv.gssp,
    boundaryKind: iv.boundaryKind ?? null,
    approximate: iv.approximate,
  };
}

export function exportJson(intervals: readonly Interval[]): string {
  const plain = intervals.map((iv) => ({ ...intervalFields(iv), names: iv.names, order: iv.order }));
  return JSON.stringify(plain, null, 2) + "\n";
}

export function parseJson(text: string, options: ImportOptions = {}): ParseResult & { lines: number[] } {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    return {
      intervals: [],
      lines: [],
      problems: [{ interval: "", field: "", message: `not valid JSON: ${(err as Error).message}`, rule: "syntax" }],
    };
  }
  const list =
    Array.isArray(data)
      ? data
      : data && typeof data === "object" && Array.isArray((data as { intervals?: unknown }).intervals)
        ? ((data as { intervals: unknown[] }).intervals)
        : null;
  if (!list) {
    return {
      intervals: [],
      lines: [],
      problems: [{ interval: "", field: "", message: "expected an array of intervals, or an object with an \"intervals\" array", rule: "syntax" }],
    };
  }
  const intervals: Interval[] = [];
  const lines: number[] = [];
  const problems: Problem[] = [];
  list.forEach((item, index) => {
    const v = validateInterval(item, index);
    if (v.interval) {
      intervals.push(v.interval);
      lines.push(index);
    } else problems.push(...v.problems);
  });
  if (problems.length === 0 && options.check !== false) problems.push(...check(intervals, { lines }));
  return { intervals, problems, lines };
}
