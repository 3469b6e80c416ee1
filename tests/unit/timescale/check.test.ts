import { describe, expect, it } from "vitest";
import { check, type Interval, type Problem } from "../../../app/lib/timescale";
import { tinyChart, tinyWith } from "./helpers";

const only = (problems: Problem[], rule: Problem["rule"]) => problems.filter((p) => p.rule === rule);

describe("check()", () => {
  it("accepts a valid chart", () => {
    expect(check(tinyChart())).toEqual([]);
  });

  it("rule name: a name is required", () => {
    const chart = tinyWith("Old", { name: " " });
    expect(only(check(chart), "name")).toEqual([{ interval: " ", field: "name", rule: "name", message: "name is empty" }]);
  });

  it("rule name-unique: names are unique within an edition", () => {
    const chart = tinyWith("P2", { name: "P1" });
    expect(only(check(chart), "name-unique")).toEqual([
      { interval: "P1", field: "name", rule: "name-unique", message: 'name "P1" is already used by another period' },
    ]);
  });

  it("rule number: ages are finite numbers", () => {
    const chart = tinyWith("A1", { baseMa: Number.NaN });
    expect(only(check(chart), "number")).toEqual([
      { interval: "A1", field: "baseMa", rule: "number", message: "base NaN is not a finite number of Ma" },
    ]);
  });

  it("rule base-older-than-top: base > top", () => {
    const chart = tinyWith("A1", { baseMa: 2, topMa: 4 });
    expect(only(check(chart), "base-older-than-top")).toEqual([
      { interval: "A1", field: "baseMa", rule: "base-older-than-top", message: "base 2 Ma must be older (greater) than top 4 Ma" },
    ]);
  });

  it("rule age-negative: no ages in the future", () => {
    const chart = tinyChart().map((iv) => (iv.topMa === 0 ? { ...iv, topMa: -1 } : iv));
    const p = only(check(chart), "age-negative");
    expect(p).toHaveLength(5);
    expect(p[0]).toEqual({ interval: "Young", field: "topMa", rule: "age-negative", message: "top -1 Ma is in the future (below 0 Ma)" });
  });

  it("rule uncertainty: ± is non-negative", () => {
    const chart = tinyWith("Old", { baseUncertaintyMa: -0.5 });
    expect(only(check(chart), "uncertainty")).toEqual([
      { interval: "Old", field: "baseUncertaintyMa", rule: "uncertainty", message: "base uncertainty -0.5 Ma is negative" },
    ]);
  });

  it("rule color: #RRGGBB", () => {
    const chart = tinyWith("P1", { color: "#FFF" });
    expect(check(chart)).toEqual([
      { interval: "P1", field: "color", rule: "color", message: 'colour "#FFF" is not a hex colour "#RRGGBB"' },
    ]);
  });

  it("rule parent-exists", () => {
    const chart = tinyWith("A1", { parent: "Ep9" });
    expect(only(check(chart), "parent-exists")).toEqual([
      { interval: "A1", field: "parent", rule: "parent-exists", message: 'parent "Ep9" does not exist in this edition' },
    ]);
  });

  it("rule parent-cycle", () => {
    const chart = tinyWith("E1", { parent: "P1" });
    const p = only(check(chart), "parent-cycle");
    expect(p).toContainEqual({ interval: "E1", field: "parent", rule: "parent-cycle", message: 'following parents from "E1" loops back to it' });
    expect(p).toContainEqual({ interval: "P1", field: "parent", rule: "parent-cycle", message: 'following parents from "P1" loops back to it' });
  });

  it("rule rank-nesting: a child's rank is deeper than its parent's", () => {
    const chart = tinyWith("A1", { rank: "period" });
    expect(only(check(chart), "rank-nesting")).toEqual([
      {
        interval: "A1",
        field: "rank",
        rule: "rank-nesting",
        message: 'rank period is not deeper than the rank of its parent "Ep2" (epoch); ranks nest eon > era > period > subperiod > epoch > age',
      },
    ]);
  });

  it("rule rank-nesting allows skipped ranks (subperiod optional; an age straight under a period)", () => {
    const chart = tinyChart().filter((iv) => iv.name !== "Ep1" && iv.name !== "Ep2");
    const ages = chart.map((iv) =>
      iv.name === "A1" ? { ...iv, parent: "P3", baseMa: 10 } : iv.name === "A2" ? { ...iv, parent: "P3" } : iv,
    );
    expect(check(ages)).toEqual([]);
  });

  it("rule root-eon: roots are eons only", () => {
    const chart = tinyWith("E1", { parent: null });
    expect(only(check(chart), "root-eon")).toEqual([
      { interval: "E1", field: "parent", rule: "root-eon", message: "era has no parent; only eons may be roots" },
    ]);
  });

  it("rule root-eon: an eon has no parent", () => {
    const chart = tinyWith("Old", { parent: "Young" });
    expect(only(check(chart), "root-eon")).toEqual([
      { interval: "Old", field: "parent", rule: "root-eon", message: 'an eon cannot have a parent (has "Young")' },
    ]);
  });

  it("rule tiling-base: the oldest child starts where its parent starts", () => {
    const chart = tinyWith("P1", { baseMa: 19 });
    expect(only(check(chart), "tiling-base")).toEqual([
      {
        interval: "P1",
        field: "baseMa",
        rule: "tiling-base",
        message: 'base 19 Ma does not meet the base of its parent "E1" (20 Ma); the oldest child must start where its parent starts',
      },
    ]);
  });

  it("rule tiling-top: the youngest child ends where its parent ends", () => {
    const chart = tinyWith("A2", { topMa: 0.5 });
    const p = check(chart);
    expect(only(p, "tiling-top")).toEqual([
      {
        interval: "A2",
        field: "topMa",
        rule: "tiling-top",
        message: 'top 0.5 Ma does not meet the top of its parent "Ep2" (0 Ma); the youngest child must end where its parent ends',
      },
    ]);
  });

  it("rule sibling-gap: no gap between consecutive children", () => {
    const chart = tinyWith("P2", { baseMa: 14 });
    expect(check(chart)).toEqual([
      {
        interval: "P2",
        field: "baseMa",
        rule: "sibling-gap",
        message: 'gap of 1 Ma under "E1" between "P1" (top 15 Ma) and "P2" (base 14 Ma)',
      },
    ]);
  });

  it("rule sibling-overlap: no overlap between consecutive children", () => {
    const chart = tinyWith("A2", { baseMa: 2.5 });
    expect(check(chart)).toEqual([
      {
        interval: "A2",
        field: "baseMa",
        rule: "sibling-overlap",
        message: 'overlap of 0.5 Ma under "Ep2" between "A1" (top 2 Ma) and "A2" (base 2.5 Ma)',
      },
    ]);
  });

  it("rule boundary-consistency: a parent and its oldest child share one boundary", () => {
    const chart = tinyWith("A1", { approximate: true, baseUncertaintyMa: 0.1, gssp: true });
    expect(check(chart)).toEqual([
      {
        interval: "A1",
        field: "baseUncertaintyMa",
        rule: "boundary-consistency",
        message: 'base uncertainty ± 0.1 Ma differs from none on the same boundary (4 Ma) of its parent "Ep2"',
      },
      {
        interval: "A1",
        field: "approximate",
        rule: "boundary-consistency",
        message: 'base is marked approximate (~) but the same boundary (4 Ma) of its parent "Ep2" is not',
      },
      {
        interval: "A1",
        field: "gssp",
        rule: "boundary-consistency",
        message: 'GSSP flag true differs from false on the same boundary (4 Ma) of its parent "Ep2"',
      },
    ]);
  });

  it("rule rank-gap: no gap within a rank across the whole chart", () => {
    const chart = tinyWith("Old", { topMa: 21 });
    expect(check(chart)).toEqual([
      {
        interval: "Young",
        field: "baseMa",
        rule: "rank-gap",
        message: 'gap of 1 Ma at eon rank between "Old" (top 21 Ma) and "Young" (base 20 Ma)',
      },
    ]);
  });

  it("rule rank-overlap: no overlap within a rank across the whole chart", () => {
    const chart = tinyWith("Old", { topMa: 19.5 });
    expect(check(chart)).toEqual([
      {
        interval: "Young",
        field: "baseMa",
        rule: "rank-overlap",
        message: 'overlap of 0.5 Ma at eon rank between "Old" (top 19.5 Ma) and "Young" (base 20 Ma)',
      },
    ]);
  });

  it("rule rank-gap also between cousins (an undivided leaf counts at deeper ranks)", () => {
    // P2 ends at 11 instead of 10: its parent's tiling breaks, and at period rank P2 and P3
    // (children of different eras) leave 11–10 Ma uncovered.
    const chart = tinyWith("P2", { topMa: 11 });
    const p = check(chart);
    expect(p.map((x) => x.rule).sort()).toEqual(["rank-gap", "tiling-top"]);
    expect(only(p, "rank-gap")[0].message).toBe('gap of 1 Ma at period rank between "P2" (top 11 Ma) and "P3" (base 10 Ma)');
  });

  it("rule youngest-top: the chart reaches the present", () => {
    const chart = tinyChart().map((iv) => (iv.topMa === 0 ? { ...iv, topMa: 1 } : iv));
    expect(check(chart)).toEqual([
      {
        interval: "Young",
        field: "topMa",
        rule: "youngest-top",
        message: "the youngest top is 1 Ma; the chart must reach the present (0 Ma)",
      },
    ]);
  });

  it("compares numbers as written, to 1e-9 (no float noise)", () => {
    const chart = tinyWith("A1", { topMa: 0.1 + 0.2, baseMa: 4 }).map((iv) =>
      iv.name === "A2" ? { ...iv, baseMa: 0.3 } : iv,
    );
    expect(check(chart)).toEqual([]);
    const off = tinyWith("A2", { baseMa: 2 + 1e-7 });
    expect(check(off)[0].message).toBe('overlap of 0.0000001 Ma under "Ep2" between "A1" (top 2 Ma) and "A2" (base 2.0000001 Ma)');
  });

  it("attaches source lines when given", () => {
    const chart = tinyWith("P1", { color: "red" });
    const lines = chart.map((_, i) => i + 2); // e.g. CSV lines after the header
    expect(check(chart, { lines })).toEqual([
      { interval: "P1", field: "color", rule: "color", message: 'colour "red" is not a hex colour "#RRGGBB"', line: 5 },
    ]);
  });

  it("reports an empty edition", () => {
    expect(check([] as Interval[])).toEqual([{ interval: "", field: "intervals", rule: "youngest-top", message: "the edition has no intervals" }]);
  });
});
