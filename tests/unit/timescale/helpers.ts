import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Edition, Interval } from "../../../app/lib/timescale";

export const repoRoot = join(dirname(fileURLToPath(import.meta.url)), "..", "..", "..");

export function loadEdition(slug: "ics-2024-12" | "ics-2023-09"): Edition {
  return JSON.parse(readFileSync(join(repoRoot, "db", "data", "ics", `${slug}.json`), "utf8")) as Edition;
}

export function sourceTurtle(file: "ics-chart-2024-12.ttl" | "ics-chart-2023-09.ttl"): string {
  return readFileSync(join(repoRoot, "db", "data", "ics", "source", file), "utf8");
}

export function byName(intervals: readonly Interval[], name: string): Interval {
  const iv = intervals.find((i) => i.name === name);
  if (!iv) throw new Error(`no interval "${name}"`);
  return iv;
}

/** A tiny valid chart used by the rule tests:
 *
 *   Old (eon) 30–20
 *   Young (eon) 20–0
 *     E1 (era) 20–10:  P1 (period) 20–15, P2 (period) 15–10
 *     E2 (era) 10–0:   P3 (period) 10–0
 *                        Ep1 (epoch) 10–4
 *                        Ep2 (epoch) 4–0:  A1 (age) 4–2, A2 (age) 2–0
 */
export function tinyChart(): Interval[] {
  const iv = (
    name: string,
    rank: Interval["rank"],
    parent: string | null,
    baseMa: number,
    topMa: number,
    order: number,
  ): Interval => ({
    name,
    rank,
    parent,
    baseMa,
    baseUncertaintyMa: null,
    topMa,
    color: "#ABCDEF",
    gssp: false,
    boundaryKind: null,
    approximate: false,
    names: {},
    order,
  });
  return [
    iv("Old", "eon", null, 30, 20, 1),
    iv("Young", "eon", null, 20, 0, 2),
    iv("E1", "era", "Young", 20, 10, 3),
    iv("P1", "period", "E1", 20, 15, 4),
    iv("P2", "period", "E1", 15, 10, 5),
    iv("E2", "era", "Young", 10, 0, 6),
    iv("P3", "period", "E2", 10, 0, 7),
    iv("Ep1", "epoch", "P3", 10, 4, 8),
    iv("Ep2", "epoch", "P3", 4, 0, 9),
    iv("A1", "age", "Ep2", 4, 2, 10),
    iv("A2", "age", "Ep2", 2, 0, 11),
  ];
}

/** tinyChart() with one interval changed. */
export function tinyWith(name: string, change: Partial<Interval>): Interval[] {
  return tinyChart().map((iv) => (iv.name === name ? { ...iv, ...change } : iv));
}
