import { describe, expect, it } from "vitest";
import { applyCorrections, check, CorrectionError, parseTurtle, type Problem } from "../../../app/lib/timescale";
import { loadEdition, sourceTurtle } from "./helpers";

const cache = new Map<string, ReturnType<typeof parseTurtle>>();
const parsedSource = (file: "ics-chart-2024-12.ttl" | "ics-chart-2023-09.ttl") => {
  let r = cache.get(file);
  if (!r) cache.set(file, (r = parseTurtle(sourceTurtle(file))));
  return r;
};

const summary = (ps: Problem[]) => ps.map((p) => `${p.interval} ${p.field} ${p.rule}`);

describe("Turtle import of the copied ICS source files", () => {
  const cases = [
    { file: "ics-chart-2024-12.ttl", slug: "ics-2024-12" },
    { file: "ics-chart-2023-09.ttl", slug: "ics-2023-09" },
  ] as const;

  for (const { file, slug } of cases) {
    it(`${file}: after the recorded corrections, gives exactly the generated ${slug}.json intervals`, () => {
      const parsed = parsedSource(file);
      const edition = loadEdition(slug);
      expect(applyCorrections(parsed.intervals, edition.edition.corrections)).toEqual(edition.intervals);
    });

    it(`${file}: its problems are what check() finds, plus the file's own structural notes`, () => {
      const parsed = parsedSource(file);
      const fromCheck = check(parsed.intervals, { lines: parsed.lines });
      const key = (p: Problem) => JSON.stringify(p);
      expect(parsed.problems.filter((p) => p.rule !== "source").map(key).sort()).toEqual(fromCheck.map(key).sort());
    });

    it(`${file}: leaves out the Precambrian super-eon only`, () => {
      const parsed = parsedSource(file);
      expect(parsed.excluded.map((x) => [x.name, x.rank])).toEqual([["Precambrian", "Super-Eon"]]);
      expect(parsed.intervals).toHaveLength(177);
    });
  }

  it("2024/12: finds the Aquitanian base that misses the Miocene's, the Ludlow/Pridoli overlap and 26 unlabelled intervals", () => {
    const parsed = parsedSource("ics-chart-2024-12.ttl");
    const invariants = parsed.problems.filter((p) => p.rule !== "source");
    expect(summary(invariants).sort()).toEqual(
      [
        "Aquitanian baseMa tiling-base",
        "Aquitanian baseMa rank-gap",
        "Ludfordian topMa tiling-top",
        "Pridoli baseMa sibling-overlap",
        // The Neoproterozoic is marked both GSSP and GSSA (kind left unstated), its oldest child the Tonian GSSA only.
        "Tonian boundaryKind boundary-consistency",
      ].sort(),
    );
    expect(invariants.find((p) => p.rule === "tiling-base")!.message).toBe(
      'base 23.03 Ma does not meet the base of its parent "Miocene" (23.04 Ma); the oldest child must start where its parent starts',
    );
    const unlabelled = parsed.problems.filter((p) => p.rule === "source");
    expect(unlabelled.filter((p) => p.field === "name")).toHaveLength(26);
    // …and one concept marked both GSSP and GSSA.
    expect(unlabelled.filter((p) => p.field !== "name").map((p) => `${p.interval} ${p.field}`)).toEqual(["Neoproterozoic boundaryKind"]);
  });

  it("2023/09: finds the swapped bases and tops (Valanginian, Olenekian, Paleozoic), Cambrian Stage 2 and the Ludlow", () => {
    const parsed = parsedSource("ics-chart-2023-09.ttl");
    const swapped = parsed.problems.filter((p) => p.rule === "base-older-than-top");
    expect(swapped.map((p) => p.message).sort()).toEqual([
      "base 132.6 Ma must be older (greater) than top 139.8 Ma",
      "base 247.2 Ma must be older (greater) than top 251.2 Ma",
      "base 251.902 Ma must be older (greater) than top 538.8 Ma",
    ]);
    expect(swapped.map((p) => p.interval).sort()).toEqual(["Olenekian", "Paleozoic", "Valanginian"]);
    expect(summary(parsed.problems)).toContain("Cambrian-Stage 2 topMa tiling-top");
    expect(summary(parsed.problems)).toContain("Cambrian-Stage 2 baseMa sibling-gap");
    expect(summary(parsed.problems)).toContain("Ludfordian topMa tiling-top");
    expect(parsed.problems.filter((p) => p.rule === "source")).toEqual([]);
  });

  it("points each problem at the line where the interval's description starts", () => {
    const text = sourceTurtle("ics-chart-2023-09.ttl");
    const lines = text.split("\n");
    const parsed = parseTurtle(text);
    const p = parsed.problems.find((x) => x.interval === "Valanginian")!;
    expect(lines[p.line! - 1]).toBe("ischart:Valanginian");
  });

  it("reads base/top, ±, '~', colour, GSSP/GSSA, parent and names as the file encodes them", () => {
    const parsed = parsedSource("ics-chart-2024-12.ttl");
    const get = (n: string) => parsed.intervals.find((i) => i.name === n)!;
    expect(get("Devonian")).toMatchObject({ rank: "period", parent: "Paleozoic", baseMa: 419.62, baseUncertaintyMa: 1.36, topMa: 358.86, color: "#CB8C37", gssp: true, approximate: false });
    expect(get("Cryogenian")).toMatchObject({ baseMa: 720, approximate: true, baseUncertaintyMa: null, gssp: false });
    expect(get("Tonian").gssp).toBe(true); // gts:ratifiedGSSA
    expect(get("Archean")).toMatchObject({ parent: null, baseUncertaintyMa: 3 }); // broader: Precambrian (left out)
    expect(get("Pridoli").rank).toBe("epoch"); // the file gives rank:Age and rank:Epoch
    expect(get("Cretaceous").names).toMatchObject({ en: "Cretaceous", de: "Kreide", ja: "白亜系／紀" });
  });
});

describe("the generator is reproducible and the JSON on disk is current", () => {
  it("buildEdition() gives the committed JSON for each edition", async () => {
    const { buildEdition, EDITIONS } = await import("../../../db/data/ics/generate");
    const built = new Map<string, import("../../../app/lib/timescale").Edition>();
    for (const spec of EDITIONS) {
      const { edition } = buildEdition(spec, built);
      built.set(spec.meta.slug, edition);
      expect(edition).toEqual(loadEdition(spec.meta.slug as "ics-2024-12" | "ics-2023-09"));
    }
  });
});

describe("parseTurtle() on small inputs", () => {
  const PREFIXES = `PREFIX gts: <http://resource.geosciml.org/ontology/timescale/gts#>
PREFIX ischart: <http://resource.geosciml.org/classifier/ics/ischart/>
PREFIX rank: <http://resource.geosciml.org/ontology/timescale/rank/>
PREFIX schema: <https://schema.org/>
PREFIX skos: <http://www.w3.org/2004/02/skos/core#>
PREFIX time: <http://www.w3.org/2006/time#>
`;

  it("reports a syntax error with its line", () => {
    const r = parseTurtle(PREFIXES + "ischart:X a skos:Concept ;\n  skos:prefLabel \"X\"@en\n  oops .\n");
    expect(r.intervals).toEqual([]);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ rule: "syntax", line: 9 });
  });

  it("gives gssp = null when the file states no ratification at all, and flags broader/narrower disagreement", () => {
    const ttl =
      PREFIXES +
      `ischart:Only a skos:Concept ; gts:rank rank:Eon ; skos:prefLabel "Only"@en ; skos:narrower ischart:Ghost ;
  time:hasBeginning [ ischart:inMYA 10 ; schema:marginOfError 0.5 ] ; time:hasEnd [ ischart:inMYA 0 ] ;
  schema:color "#112233" .
ischart:Ghost a skos:Concept ; gts:rank rank:Era ; skos:prefLabel "Ghost"@en ;
  time:hasBeginning [ ischart:inMYA 10 ; schema:marginOfError 0.5 ] ; time:hasEnd [ ischart:inMYA 0 ] ;
  schema:color "#445566" .
`;
    const r = parseTurtle(ttl);
    expect(r.intervals.map((i) => [i.name, i.gssp, i.baseUncertaintyMa])).toEqual([
      ["Only", null, 0.5],
      ["Ghost", null, 0.5],
    ]);
    expect(r.problems).toContainEqual({
      interval: "Ghost",
      field: "parent",
      rule: "source",
      line: 10,
      message: 'is listed as skos:narrower of "Only", but its skos:broader does not name "Only"',
    });
    expect(r.problems).toContainEqual({ interval: "Ghost", field: "parent", rule: "root-eon", line: 10, message: "era has no parent; only eons may be roots" });
  });
});

describe("applyCorrections()", () => {
  const parsed = parsedSource("ics-chart-2023-09.ttl");

  it("refuses a correction whose expected value is not in the data (stale)", () => {
    expect(() =>
      applyCorrections(parsed.intervals, [{ interval: "Valanginian", field: "baseMa", from: 999, to: 139.8, reason: "x", source: "y" }]),
    ).toThrow(CorrectionError);
    expect(() =>
      applyCorrections(parsed.intervals, [{ interval: "Nowhere", field: "baseMa", from: 1, to: 2, reason: "x", source: "y" }]),
    ).toThrow(/no interval of that name/);
  });

  it("renames children's parent references with the interval", () => {
    const out = applyCorrections(parsed.intervals, [{ interval: "Early Triassic", field: "name", from: "Early Triassic", to: "Lower Triassic", reason: "x", source: "y" }]);
    expect(out.find((i) => i.name === "Induan")!.parent).toBe("Lower Triassic");
  });
});
