import { describe, expect, it } from "vitest";
import { compare, type Interval } from "../../../app/lib/timescale";
import { loadEdition, tinyChart } from "./helpers";

const edit = (chart: Interval[], name: string, change: Partial<Interval>) =>
  chart.map((iv) => (iv.name === name ? { ...iv, ...change } : iv));

describe("compare() on hand-made pairs", () => {
  it("finds nothing between identical editions", () => {
    const c = compare(tinyChart(), tinyChart());
    expect(c.moved).toEqual([]);
    expect(c.renamed).toEqual([]);
    expect(c.added).toEqual([]);
    expect(c.removed).toEqual([]);
    expect(c.matched).toHaveLength(11);
  });

  it("reports a moved boundary with its shift in Ma and %", () => {
    let b = edit(tinyChart(), "P2", { baseMa: 16 });
    b = edit(b, "P1", { topMa: 16 });
    const c = compare(tinyChart(), b);
    expect(c.moved).toEqual([{ name: "P2", rank: "period", oldBaseMa: 15, newBaseMa: 16, shiftMa: 1, shiftPercent: 6.666666667 }]);
  });

  it("reports changed uncertainty and approximate flag", () => {
    const b = edit(edit(tinyChart(), "P2", { baseUncertaintyMa: 0.3 }), "A2", { approximate: true });
    expect(compare(tinyChart(), b).uncertaintyChanged).toEqual([
      { name: "P2", rank: "period", oldUncertaintyMa: null, newUncertaintyMa: 0.3, oldApproximate: false, newApproximate: false },
      { name: "A2", rank: "age", oldUncertaintyMa: null, newUncertaintyMa: null, oldApproximate: false, newApproximate: true },
    ]);
  });

  it("reports added and removed intervals", () => {
    // New edition splits A2 (2–0) into A2 (2–1) and A3 (1–0); drops the Old eon.
    const b = [
      ...edit(tinyChart(), "A2", { topMa: 1 }).filter((iv) => iv.name !== "Old"),
      { ...tinyChart()[10], name: "A3", baseMa: 1, topMa: 0, order: 12 },
    ];
    const c = compare(tinyChart(), b);
    expect(c.added).toEqual([{ name: "A3", rank: "age", baseMa: 1, topMa: 0 }]);
    expect(c.removed).toEqual([{ name: "Old", rank: "eon", baseMa: 30, topMa: 20 }]);
  });

  it("matches renames by rank and position, renamed parents first", () => {
    // Ep2 becomes "Late P3" and its base moves from 4 to 4.2 Ma (with A1's base and Ep1's top).
    const b = tinyChart().map((iv) =>
      iv.name === "Ep2" ? { ...iv, name: "Late P3", baseMa: 4.2 } : iv.parent === "Ep2" ? { ...iv, parent: "Late P3" } : iv,
    );
    const b2 = edit(edit(b, "A1", { baseMa: 4.2 }), "Ep1", { topMa: 4.2 });
    const c = compare(tinyChart(), b2);
    expect(c.renamed).toEqual([{ oldName: "Ep2", newName: "Late P3", rank: "epoch", oldBaseMa: 4, newBaseMa: 4.2 }]);
    expect(c.moved).toContainEqual({ name: "Late P3", oldName: "Ep2", rank: "epoch", oldBaseMa: 4, newBaseMa: 4.2, shiftMa: 0.2, shiftPercent: 5 });
    expect(c.parentChanged).toEqual([]); // A1, A2 still sit under the same (renamed) epoch
    expect(c.added).toEqual([]);
    expect(c.removed).toEqual([]);
  });

  it("reports colour, GSSP, parent and rank changes", () => {
    let b = edit(tinyChart(), "P1", { color: "#112233" });
    b = edit(b, "P3", { gssp: true });
    b = edit(b, "A1", { gssp: null });
    b = edit(b, "Ep1", { rank: "subperiod" });
    const c = compare(tinyChart(), b);
    expect(c.colourChanged).toEqual([{ name: "P1", rank: "period", oldColor: "#ABCDEF", newColor: "#112233" }]);
    expect(c.gsspChanged).toEqual([{ name: "P3", rank: "period", oldGssp: false, newGssp: true }]);
    expect(c.gsspStated).toEqual([{ name: "A1", rank: "age", oldGssp: false, newGssp: null }]);
    expect(c.rankChanged).toEqual([{ name: "Ep1", oldRank: "epoch", newRank: "subperiod" }]);

    const moved = edit(tinyChart(), "Ep1", { parent: "E2" });
    expect(compare(tinyChart(), moved).parentChanged).toEqual([{ name: "Ep1", rank: "epoch", oldParent: "P3", newParent: "E2" }]);
  });
});

describe("compare() on the seeded editions, 2023/09 → 2024/12", () => {
  const old = loadEdition("ics-2023-09").intervals;
  const now = loadEdition("ics-2024-12").intervals;
  const c = compare(old, now);

  it("matches every interval by name (names are stable across the two seeded editions)", () => {
    expect(c.matched).toHaveLength(177);
    expect(c.added).toEqual([]);
    expect(c.removed).toEqual([]);
    expect(c.renamed).toEqual([]);
  });

  it("finds the Cretaceous base moved from ~145.0 to 143.1 Ma", () => {
    // 2023/09 printed chart: ~145.0; 2024/12 printed chart: 143.1 (from memory)
    expect(c.moved.find((m) => m.name === "Cretaceous")).toEqual({
      name: "Cretaceous",
      rank: "period",
      oldBaseMa: 145,
      newBaseMa: 143.1,
      shiftMa: -1.9,
      shiftPercent: -1.310344828,
    });
    expect(c.uncertaintyChanged.find((u) => u.name === "Cretaceous")).toEqual({
      name: "Cretaceous",
      rank: "period",
      oldUncertaintyMa: null,
      newUncertaintyMa: 0.6,
      oldApproximate: true,
      newApproximate: false,
    });
  });

  it("finds the Devonian base moved from 419.2 ± 3.2 to 419.62 ± 1.36 Ma", () => {
    expect(c.moved.find((m) => m.name === "Devonian")).toEqual({
      name: "Devonian",
      rank: "period",
      oldBaseMa: 419.2,
      newBaseMa: 419.62,
      shiftMa: 0.42,
      shiftPercent: 0.10019084,
    });
    expect(c.uncertaintyChanged.find((u) => u.name === "Devonian")).toMatchObject({ oldUncertaintyMa: 3.2, newUncertaintyMa: 1.36 });
  });

  it("leaves unchanged boundaries alone", () => {
    for (const name of ["Jurassic", "Triassic", "Paleogene", "Holocene", "Archean", "Permian"]) {
      expect(c.moved.find((m) => m.name === name)).toBeUndefined();
    }
  });

  it("lists the moved periods", () => {
    expect(c.moved.filter((m) => m.rank === "period").map((m) => m.name)).toEqual([
      "Ordovician",
      "Silurian",
      "Devonian",
      "Carboniferous",
      "Cretaceous",
      "Neogene",
    ]);
  });

  it("reports the one GSSP ratified between the editions (2023/09's flags are carried over from 2024/12)", () => {
    expect(c.gsspChanged.map((g) => [g.name, g.oldGssp, g.newGssp])).toEqual([["Valanginian", false, true]]);
    expect(c.gsspStated).toEqual([]);
    expect(c.colourChanged).toEqual([]);
  });
});
