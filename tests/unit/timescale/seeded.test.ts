// Seeded editions vs the published chart.
//
// Each expected value below was typed from the printed ICS chart of the edition named beside it,
// as the author knows that chart — not copied from the data files. None could be checked against
// the chart PDF while writing, so every value is marked "from memory". Where the recollection is
// weak (or may lean on the data file itself) the note says so.

import { describe, expect, it } from "vitest";
import { RANKS, check, type Interval } from "../../../app/lib/timescale";
import { byName, loadEdition } from "./helpers";

import { SEEDS } from "../../fixtures/ics-chart-check-values.ts";

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
