// The interval-name consistency check: hand-made entries that must warn and must not, on the
// seeded editions (real interval names and translations), and the whole shared library.
import { describe, expect, it } from "vitest";
import { checkIntervalNames, mentionsIn, nameIndex, qualifiedSpan, type NamedEvent } from "../../../app/lib/interval-consistency";
import { SEED_DATED_EVENTS } from "../../../db/data/dated-events/dated-events.ts";
import { byName, loadEdition } from "../timescale/helpers";

const e24 = loadEdition("ics-2024-12");
const e23 = loadEdition("ics-2023-09");
const warn24 = (events: NamedEvent[]) => checkIntervalNames(e24.intervals, events, { editionLabel: "ICS 2024/12" });
const ev = (name: string, ageMa: number | string, more: Partial<NamedEvent> = {}): NamedEvent => ({ name, ageMa, ...more });

describe("events that must warn", () => {
  it("an age outside a named period, epoch and stage (each rank below era)", () => {
    const w = warn24([
      ev("Trilobite bed (Cambrian)", 400),
      ev("Ammonite in the Late Jurassic", 170),
      ev("Reef of the Frasnian", 390),
      ev("Mesozoic reptile", 260),
      ev("A Proterozoic stromatolite", 2600),
    ]);
    expect(w.map((x) => [x.eventName, x.interval])).toEqual([
      ["Trilobite bed (Cambrian)", "Cambrian"],
      ["Ammonite in the Late Jurassic", "Late Jurassic"],
      ["Reef of the Frasnian", "Frasnian"],
      ["Mesozoic reptile", "Mesozoic"],
      ["A Proterozoic stromatolite", "Proterozoic"],
    ]);
  });

  it("names both the event and the interval, with the interval's bounds", () => {
    const [w] = warn24([ev("Oldest tetrapod trackways", 397, { summary: "Footprints from the early Middle Devonian of Poland." })]);
    // ICS 2024/12 (db/data/ics/ics-2024-12.json): Middle Devonian 393.47 ± 0.99 – 382.31 Ma.
    expect(w.message).toBe(
      "“Oldest tetrapod trackways” (397 Ma) names the early part of the Middle Devonian, but on ICS 2024/12 the Middle Devonian runs from 393.47 ± 0.99 to 382.31 Ma (the early part of it: about 393.47 to 387.89 Ma).",
    );
    expect(w).toMatchObject({ interval: "Middle Devonian", qualifier: "early", field: "summary", fromMa: 393.47, toMa: 387.89 });
  });

  it("the two library mistakes the check was written for (397 Ma 'Middle Devonian', 225 Ma 'late Carnian')", () => {
    const w = warn24([
      ev("Zachełmie trackways (old text)", 397, { summary: "Footprints on a Middle Devonian tidal flat.", datingMethod: "Conodont biostratigraphy (early Eifelian)" }),
      ev("Adelobasileus (old text)", 225, { datingMethod: "Biostratigraphy (late Carnian)" }),
    ]);
    expect(w.map((x) => `${x.eventName}: ${x.mentioned}`)).toEqual([
      "Zachełmie trackways (old text): Middle Devonian",
      "Zachełmie trackways (old text): Eifelian",
      "Adelobasileus (old text): Carnian",
    ]);
    expect(w[2].message).toContain("the late part of the Carnian");
    expect(w[2].message).toContain("237 to 227.3 Ma");
  });

  it("early / middle / late qualifiers narrow the interval", () => {
    // Frasnian 382.31 – 372.15 Ma on ICS 2024/12: halves split at 377.23.
    const frasnian = byName(e24.intervals, "Frasnian");
    expect(qualifiedSpan(frasnian, "early")).toEqual({ fromMa: 382.31, toMa: 377.23 });
    const w = warn24([
      ev("late Frasnian fish, dated early", 381),
      ev("early Frasnian reef, dated late", 373),
      ev("middle Frasnian shale, dated at the start", 382),
      ev("Lower Frasnian limestone, dated late", 374),
    ]);
    expect(w.map((x) => [x.eventName, x.qualifier])).toEqual([
      ["late Frasnian fish, dated early", "late"],
      ["early Frasnian reef, dated late", "early"],
      ["middle Frasnian shale, dated at the start", "middle"],
      ["Lower Frasnian limestone, dated late", "early"],
    ]);
  });

  it("names in other languages the chart carries", () => {
    const cretaceous = byName(e24.intervals, "Cretaceous");
    const de = cretaceous.names.de;
    expect(de).toBeTruthy();
    const [w] = warn24([ev(`Ammonit aus der ${de}`, 50)]);
    expect(w.interval).toBe("Cretaceous");
    expect(w.mentioned).toBe(de);
    expect(w.message).toContain(`“${de}” (the Cretaceous)`);
    const jurassicFr = byName(e24.intervals, "Jurassic").names.fr;
    expect(warn24([ev(`Récif du ${jurassicFr}`, 300)]).map((x) => x.interval)).toEqual(["Jurassic"]);
  });

  it("a boundary named by two intervals or by 'base of' must lie at that boundary", () => {
    const w = warn24([ev("Impact at the Cretaceous–Paleogene boundary", 65, { uncertaintyMa: "0.05" }), ev("Fossil near the base of the Famennian", 365)]);
    expect(w.map((x) => [x.interval, x.boundary])).toEqual([
      ["Paleogene", "base"],
      ["Famennian", "base"],
    ]);
    expect(w[0].message).toContain("that boundary is at 66 Ma");
  });
});

describe("events that must not warn", () => {
  it("inside the interval, its part, or at the boundary it names", () => {
    expect(
      warn24([
        ev("Trilobite bed (Cambrian)", 500),
        ev("late Frasnian fish", 375),
        ev("early Middle Devonian trackways", 390),
        ev("Chicxulub impact", "66.043", { uncertaintyMa: "0.043", summary: "Ejecta at the Cretaceous–Paleogene boundary." }),
        ev("Late Devonian extinction (Frasnian–Famennian)", "372.15", { uncertaintyMa: "0.46", summary: "At the boundary between the Frasnian and Famennian stages." }),
        ev("End-Permian mass extinction", "251.941"),
        ev("Cambrian explosion", "538.8", { summary: "From the base of the Cambrian (Fortunian)." }),
        ev("Holocene begins", "0.0117"),
        ev("Today", 0, { summary: "Meghalayan, Holocene" }),
      ]),
    ).toEqual([]);
  });

  it("an age whose ± reaches into the interval", () => {
    // Eifelian base 393.47 ± 0.99 on ICS 2024/12: 394 ± 1 overlaps it.
    expect(warn24([ev("Eifelian conodont", 394, { uncertaintyMa: 1 })])).toEqual([]);
    expect(warn24([ev("Eifelian conodont", 396)])).toHaveLength(1);
  });

  it("ordinary words and place names are not interval names", () => {
    const index = nameIndex(e24.intervals);
    expect(mentionsIn("Possible stromatolites at Isua, Greenland", index)).toEqual([]);
    expect(mentionsIn("An early human relative from the Afar", index)).toEqual([]);
  });
});

describe("the shared library", () => {
  it.each([
    ["ICS 2024/12", e24],
    ["ICS 2023/09", e23],
  ] as const)("has no interval-name warnings on %s", (label, edition) => {
    expect(checkIntervalNames(edition.intervals, SEED_DATED_EVENTS, { editionLabel: label }).map((w) => w.message)).toEqual([]);
  });

  it("actually names intervals, so the check has something to check", () => {
    const index = nameIndex(e24.intervals);
    const named = SEED_DATED_EVENTS.filter((e) => [e.name, e.summary, e.datingMethod ?? ""].some((t) => mentionsIn(t, index).length > 0));
    expect(named.length).toBeGreaterThanOrEqual(12);
  });
});
