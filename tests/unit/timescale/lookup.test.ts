import { describe, expect, it } from "vitest";
import { baseOf, chainAt, intervalsAt } from "../../../app/lib/timescale";
import { loadEdition } from "./helpers";

const e24 = loadEdition("ics-2024-12").intervals;
const e23 = loadEdition("ics-2023-09").intervals;
const names = (o: ReturnType<typeof intervalsAt>) => Object.fromEntries(Object.entries(o).map(([k, v]) => [k, v!.name]));

describe("intervalsAt()", () => {
  it("gives the interval at each rank; the base belongs to the interval it begins", () => {
    expect(names(intervalsAt(e24, 66.0))).toEqual({ eon: "Phanerozoic", era: "Cenozoic", period: "Paleogene", epoch: "Paleocene", age: "Danian" });
    expect(names(intervalsAt(e24, 66.01))).toEqual({ eon: "Phanerozoic", era: "Mesozoic", period: "Cretaceous", epoch: "Late Cretaceous", age: "Maastrichtian" });
  });

  it("includes the subperiod inside the Carboniferous", () => {
    expect(names(intervalsAt(e24, 300))).toEqual({
      eon: "Phanerozoic",
      era: "Paleozoic",
      period: "Carboniferous",
      subperiod: "Pennsylvanian",
      epoch: "Late Pennsylvanian",
      age: "Gzhelian",
    });
  });

  it("stops where the chart stops dividing", () => {
    expect(names(intervalsAt(e24, 421))).toEqual({ eon: "Phanerozoic", era: "Paleozoic", period: "Silurian", epoch: "Pridoli" });
    expect(names(intervalsAt(e24, 1000))).toEqual({ eon: "Proterozoic", era: "Neoproterozoic", period: "Tonian" });
    expect(names(intervalsAt(e24, 4100))).toEqual({ eon: "Hadean" });
  });

  it("puts the present in the youngest intervals and nothing outside the chart", () => {
    expect(intervalsAt(e24, 0).age?.name).toBe("Meghalayan");
    expect(intervalsAt(e24, 4567).eon?.name).toBe("Hadean");
    expect(intervalsAt(e24, 4567.1)).toEqual({});
    expect(intervalsAt(e24, -0.001)).toEqual({});
    expect(intervalsAt(e24, Number.NaN)).toEqual({});
  });

  it("differs between editions where a boundary moved", () => {
    expect(intervalsAt(e23, 144).period?.name).toBe("Cretaceous"); // base ~145.0 in 2023/09
    expect(intervalsAt(e24, 144).period?.name).toBe("Jurassic"); // base 143.1 in 2024/12
  });
});

describe("chainAt()", () => {
  it("gives eon → age", () => {
    expect(chainAt(e24, 0.005).map((i) => i.name)).toEqual(["Phanerozoic", "Cenozoic", "Quaternary", "Holocene", "Northgrippian"]);
    expect(chainAt(e24, 320).map((i) => i.name)).toEqual([
      "Phanerozoic",
      "Paleozoic",
      "Carboniferous",
      "Pennsylvanian",
      "Early Pennsylvanian",
      "Bashkirian",
    ]);
    expect(chainAt(e24, 3000).map((i) => i.name)).toEqual(["Archean", "Mesoarchean"]);
    expect(chainAt(e24, 5000)).toEqual([]);
  });
});

describe("baseOf()", () => {
  it("gives the base with its ± and flags", () => {
    expect(baseOf(e24, "Cambrian")).toEqual({ name: "Cambrian", rank: "period", baseMa: 538.8, baseUncertaintyMa: 0.6, approximate: false, gssp: true, boundaryKind: "GSSP" });
    expect(baseOf(e23, "Cretaceous")).toEqual({ name: "Cretaceous", rank: "period", baseMa: 145, baseUncertaintyMa: null, approximate: true, gssp: false, boundaryKind: null });
    expect(baseOf(e24, "Tonian")).toMatchObject({ baseMa: 1000, gssp: true, boundaryKind: "GSSA" });
  });

  it("falls back to a case- and space-insensitive match, else null", () => {
    expect(baseOf(e24, "  early   devonian ")?.baseMa).toBe(419.62);
    expect(baseOf(e24, "Precambrian")).toBeNull();
  });
});
