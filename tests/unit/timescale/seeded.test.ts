// Seeded editions vs the published chart.
//
// Each expected value below was typed from the printed ICS chart of the edition named beside it,
// as the author knows that chart — not copied from the data files. None could be checked against
// the chart PDF while writing, so every value is marked "from memory". Where the recollection is
// weak (or may lean on the data file itself) the note says so.

import { describe, expect, it } from "vitest";
import { RANKS, check, type Interval, type Rank } from "../../../app/lib/timescale";
import { byName, loadEdition } from "./helpers";

const CHART_2024 = "ICS International Chronostratigraphic Chart v2024/12 (printed chart)";
const CHART_2023 = "ICS International Chronostratigraphic Chart v2023/09 (printed chart)";

interface Seed {
  edition: "ics-2024-12" | "ics-2023-09";
  name: string;
  rank: Rank;
  baseMa: number;
  /** ± in Ma; null = the chart prints none; undefined = not checked. */
  pm?: number | null;
  /** the chart's "~"; undefined = not checked. */
  approx?: boolean;
  source: string;
  basis: string;
}

const m = "from memory";
const weak = "from memory (weak recollection; may lean on the data file)";

const SEEDS: Seed[] = [
  // ---- ICS 2024/12 ----
  { edition: "ics-2024-12", name: "Hadean", rank: "eon", baseMa: 4567, pm: null, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Archean", rank: "eon", baseMa: 4031, pm: 3, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Proterozoic", rank: "eon", baseMa: 2500, pm: null, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Phanerozoic", rank: "eon", baseMa: 538.8, pm: 0.6, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Neoarchean", rank: "era", baseMa: 2800, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Mesoproterozoic", rank: "era", baseMa: 1600, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Mesozoic", rank: "era", baseMa: 251.902, pm: 0.024, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Cenozoic", rank: "era", baseMa: 66.0, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Cryogenian", rank: "period", baseMa: 720, approx: true, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Ediacaran", rank: "period", baseMa: 635, approx: true, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Cambrian", rank: "period", baseMa: 538.8, pm: 0.6, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Ordovician", rank: "period", baseMa: 486.85, pm: 1.5, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Devonian", rank: "period", baseMa: 419.62, pm: 1.36, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Carboniferous", rank: "period", baseMa: 358.86, pm: 0.19, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Permian", rank: "period", baseMa: 298.9, pm: 0.15, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Triassic", rank: "period", baseMa: 251.902, pm: 0.024, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Jurassic", rank: "period", baseMa: 201.4, pm: 0.2, source: CHART_2024, basis: m },
  // The printed 2024/12 chart may show "~143.1" rather than a ±; only the figure is checked.
  { edition: "ics-2024-12", name: "Cretaceous", rank: "period", baseMa: 143.1, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Paleogene", rank: "period", baseMa: 66.0, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Neogene", rank: "period", baseMa: 23.04, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Quaternary", rank: "period", baseMa: 2.58, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Pennsylvanian", rank: "subperiod", baseMa: 323.4, pm: 0.4, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Mississippian", rank: "subperiod", baseMa: 358.86, pm: 0.19, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Holocene", rank: "epoch", baseMa: 0.0117, pm: null, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Pleistocene", rank: "epoch", baseMa: 2.58, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Pliocene", rank: "epoch", baseMa: 5.333, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Oligocene", rank: "epoch", baseMa: 33.9, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Lopingian", rank: "epoch", baseMa: 259.51, pm: 0.21, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Meghalayan", rank: "age", baseMa: 0.0042, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Northgrippian", rank: "age", baseMa: 0.0082, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Greenlandian", rank: "age", baseMa: 0.0117, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Chibanian", rank: "age", baseMa: 0.774, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Messinian", rank: "age", baseMa: 7.246, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Aquitanian", rank: "age", baseMa: 23.04, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Lutetian", rank: "age", baseMa: 48.07, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Maastrichtian", rank: "age", baseMa: 72.2, pm: 0.2, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Cenomanian", rank: "age", baseMa: 100.5, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Barremian", rank: "age", baseMa: 125.77, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Valanginian", rank: "age", baseMa: 137.05, pm: 0.2, source: CHART_2024, basis: weak },
  { edition: "ics-2024-12", name: "Hettangian", rank: "age", baseMa: 201.4, pm: 0.2, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Induan", rank: "age", baseMa: 251.902, pm: 0.024, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Changhsingian", rank: "age", baseMa: 254.14, pm: 0.07, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Lochkovian", rank: "age", baseMa: 419.62, pm: 1.36, source: CHART_2024, basis: m },
  { edition: "ics-2024-12", name: "Fortunian", rank: "age", baseMa: 538.8, pm: 0.6, source: CHART_2024, basis: m },

  // ---- ICS 2023/09 ----
  { edition: "ics-2023-09", name: "Hadean", rank: "eon", baseMa: 4567, pm: null, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Archean", rank: "eon", baseMa: 4031, pm: 3, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Phanerozoic", rank: "eon", baseMa: 538.8, pm: 0.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Paleozoic", rank: "era", baseMa: 538.8, pm: 0.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Neoproterozoic", rank: "era", baseMa: 1000, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Ordovician", rank: "period", baseMa: 485.4, pm: 1.9, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Silurian", rank: "period", baseMa: 443.8, pm: 1.5, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Devonian", rank: "period", baseMa: 419.2, pm: 3.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Carboniferous", rank: "period", baseMa: 358.9, pm: 0.4, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Triassic", rank: "period", baseMa: 251.902, pm: 0.024, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Jurassic", rank: "period", baseMa: 201.4, pm: 0.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Cretaceous", rank: "period", baseMa: 145.0, pm: null, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Paleogene", rank: "period", baseMa: 66.0, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Neogene", rank: "period", baseMa: 23.03, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Tonian", rank: "period", baseMa: 1000, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Pennsylvanian", rank: "subperiod", baseMa: 323.2, pm: 0.4, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Holocene", rank: "epoch", baseMa: 0.0117, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Miocene", rank: "epoch", baseMa: 23.03, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Eocene", rank: "epoch", baseMa: 56.0, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Late Cretaceous", rank: "epoch", baseMa: 100.5, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Guadalupian", rank: "epoch", baseMa: 273.01, pm: 0.14, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Miaolingian", rank: "epoch", baseMa: 509, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Pridoli", rank: "epoch", baseMa: 423.0, pm: 2.3, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Meghalayan", rank: "age", baseMa: 0.0042, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Calabrian", rank: "age", baseMa: 1.8, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Zanclean", rank: "age", baseMa: 5.333, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Chattian", rank: "age", baseMa: 27.82, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Maastrichtian", rank: "age", baseMa: 72.1, pm: 0.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Santonian", rank: "age", baseMa: 86.3, pm: 0.5, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Hauterivian", rank: "age", baseMa: 132.6, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Valanginian", rank: "age", baseMa: 139.8, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Tithonian", rank: "age", baseMa: 149.2, pm: 0.7, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Rhaetian", rank: "age", baseMa: 208.5, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Carnian", rank: "age", baseMa: 237, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Olenekian", rank: "age", baseMa: 251.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Kungurian", rank: "age", baseMa: 283.5, pm: 0.6, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Famennian", rank: "age", baseMa: 372.2, pm: 1.6, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Lochkovian", rank: "age", baseMa: 419.2, pm: 3.2, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Hirnantian", rank: "age", baseMa: 445.2, pm: 1.4, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Tremadocian", rank: "age", baseMa: 485.4, pm: 1.9, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Cambrian Stage 2", rank: "age", baseMa: 529, approx: true, source: CHART_2023, basis: m },
  { edition: "ics-2023-09", name: "Fortunian", rank: "age", baseMa: 538.8, pm: 0.2, source: CHART_2023, basis: m },
];

const editions = { "ics-2024-12": loadEdition("ics-2024-12"), "ics-2023-09": loadEdition("ics-2023-09") };

describe("seeded editions vs the printed chart", () => {
  it("covers at least 30 boundaries, every rank and both editions", () => {
    expect(SEEDS.length).toBeGreaterThanOrEqual(30);
    for (const e of ["ics-2024-12", "ics-2023-09"] as const) {
      const ranks = new Set(SEEDS.filter((s) => s.edition === e).map((s) => s.rank));
      expect([...ranks].sort()).toEqual([...RANKS].sort());
    }
    for (const s of SEEDS) expect(s.basis).toMatch(/from memory/);
  });

  it.each(SEEDS.map((s) => [`${s.edition} ${s.name} base ${s.baseMa}${s.pm ? ` ± ${s.pm}` : ""} (${s.source}, ${s.basis})`, s] as const))(
    "%s",
    (_label, s) => {
      const iv = byName(editions[s.edition].intervals, s.name);
      expect(iv.rank).toBe(s.rank);
      expect(iv.baseMa).toBe(s.baseMa);
      if (s.pm !== undefined) expect(iv.baseUncertaintyMa).toBe(s.pm);
      if (s.approx !== undefined) expect(iv.approximate).toBe(s.approx);
    },
  );
});

describe("seeded editions: shape", () => {
  const count = (ivs: Interval[]) => Object.fromEntries(RANKS.map((r) => [r, ivs.filter((i) => i.rank === r).length]));

  it("holds every eon, era, period, subperiod, epoch and age; no super-eon", () => {
    for (const e of Object.values(editions)) {
      expect(count(e.intervals)).toEqual({ eon: 4, era: 10, period: 22, subperiod: 2, epoch: 38, age: 101 });
      expect(e.intervals.find((i) => i.name === "Precambrian")).toBeUndefined();
      expect(e.intervals.filter((i) => i.parent === null).map((i) => i.name)).toEqual(["Hadean", "Archean", "Proterozoic", "Phanerozoic"]);
    }
  });

  it("passes check() and is in chart order (1…n, oldest first, depth first)", () => {
    for (const e of Object.values(editions)) {
      expect(check(e.intervals)).toEqual([]);
      expect(e.intervals.map((i) => i.order)).toEqual(e.intervals.map((_, k) => k + 1));
      expect(e.intervals[0].name).toBe("Hadean");
      expect(e.intervals[e.intervals.length - 1].name).toBe("Meghalayan");
    }
  });

  it("carries edition metadata, licence and the corrections", () => {
    const a = editions["ics-2024-12"].edition;
    const b = editions["ics-2023-09"].edition;
    expect([a.slug, a.label, a.status]).toEqual(["ics-2024-12", "ICS 2024/12", "current"]);
    expect([b.slug, b.label, b.status]).toEqual(["ics-2023-09", "ICS 2023/09", "retired"]);
    expect(a.licence).toMatch(/^CC BY 4\.0/);
    expect(a.source).toContain("Episodes 48: 105–115");
    expect(b.source).toContain("Episodes 36: 199–204");
    expect(a.sourceFile).toBe("db/data/ics/source/ics-chart-2024-12.ttl");
    for (const c of [...a.corrections, ...b.corrections]) {
      expect(c.reason.length).toBeGreaterThan(20);
      expect(c.source.length).toBeGreaterThan(10);
    }
  });

  it("keeps the standard chart colours and GSSP flags the files carry", () => {
    const e24 = editions["ics-2024-12"].intervals;
    const e23 = editions["ics-2023-09"].intervals;
    // CGMW/ICS standard colours (from memory): Cretaceous 127/198/78, Jurassic 52/178/201.
    expect(byName(e24, "Cretaceous").color).toBe("#7FC64E");
    expect(byName(e24, "Jurassic").color).toBe("#34B2C9");
    expect(byName(e24, "Fortunian").gssp).toBe(true); // base of the Cambrian: GSSP (Fortune Head)
    expect(byName(e24, "Berriasian").gssp).toBe(false); // base of the Cretaceous: no GSSP yet
    expect(byName(e24, "Tonian").gssp).toBe(true); // GSSA (1000 Ma)
    expect(byName(e24, "Valanginian").gssp).toBe(true); // GSSP ratified for 2024/12 (file's own version note)
    expect(e23.every((i) => i.gssp === null)).toBe(true); // the 2023/09 file states no ratification at all
  });

  it("stores the Holocene in Ma (the chart prints years b2k)", () => {
    for (const e of Object.values(editions)) {
      expect(byName(e.intervals, "Holocene").baseMa).toBe(0.0117); // 11,700 a b2k
      expect(byName(e.intervals, "Northgrippian").baseMa).toBe(0.0082); // 8,200 a b2k
      expect(byName(e.intervals, "Meghalayan").topMa).toBe(0);
    }
  });
});
