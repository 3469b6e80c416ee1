// The automatic review checks as a pure function: each check passes and fails on purpose, with its
// reason in words and the marker it concerns.
import { describe, expect, it } from "vitest";
import { failuresInWords, MIN_SOURCE_LENGTH, runChecks, sourceProblem, statesMagnification, warningKeyOf, type CheckInput } from "../../../app/lib/review/checks.ts";
import type { CheckKind, CheckResult } from "../../../app/lib/review/types.ts";
import { boundary, custom, numbered, PINNED, rope } from "./fixture.ts";

const jurassic = boundary("1", "Jurassic");
const paleogene = boundary("2", "Paleogene");
const mill = custom("3", "Village mill built", 0.0002, { source: "Parish records of Marrowby, 1820, folio 12" });

/** On a 54.1 m rope the standard comparisons (a life, recorded history, the Holocene) are too small to see: a designer acknowledges them. */
const DURATIONS_ACKNOWLEDGED = ["life", "writing", "holocene"].map((id) => ({ warningKey: `duration-too-small:${id}`, reason: "Told in words on the panel beside the rope.", by: "Dev", at: "2026-12-01T09:00:00Z" }));

function input(fields: Partial<CheckInput> = {}): CheckInput {
  const markers = numbered(fields.markers ?? [jurassic, paleogene, mill]);
  return {
    revision: 4,
    spec: rope(),
    edition: PINNED,
    boundaries: markers.filter((m) => m.kind === "boundary").map((m) => ({ markerId: m.id, intervalName: m.intervalName!, editionId: PINNED.id, baseMa: m.ageMa })),
    acknowledgements: DURATIONS_ACKNOWLEDGED,
    recheck: null,
    ...fields,
    markers,
  };
}

const of = (results: CheckResult[], kind: CheckKind, markerId?: string) => results.filter((r) => r.kind === kind && (markerId === undefined || r.markerId === markerId));

describe("runChecks", () => {
  it("passes a correct exhibit: every boundary at the pinned edition's base, sources named, inside the span, edition current", () => {
    const report = runChecks(input());
    expect(report.overall).toBe("pass");
    expect(report.counts.fail).toBe(0);
    expect(report.counts.warning).toBe(0);
    expect(report.revision).toBe(4);
    expect(report.edition).toEqual({ slug: "ics-2024-12", label: "ICS 2024/12" });
    const [j] = of(report.results, "boundary-age", "1");
    expect(j).toMatchObject({ status: "pass", markerNumber: 1, message: "Marker 1 (“Base of the Jurassic”): 201.4 Ma is the base of the Jurassic on ICS 2024/12." });
    expect(of(report.results, "source", "3")[0].message).toBe("Marker 3 (“Village mill built”): the custom age names its source (Parish records of Marrowby, 1820, folio 12).");
    expect(of(report.results, "inside-span", "2")[0].message).toBe("Marker 2 (“Base of the Paleogene”) lies inside the span, 47.50 m from the older end."); // (541 − 66) Ma at 1 m per 10 Myr
    expect(of(report.results, "edition-current")[0]).toMatchObject({ status: "pass", markerId: null, message: "ICS 2024/12 is your organisation's current chart edition." });
    // The figures side by side, one row per boundary marker.
    expect(report.figures).toEqual([
      { markerId: "1", number: 1, label: "Base of the Jurassic", intervalName: "Jurassic", exhibitAgeMa: 201.4, exhibitUncertaintyMa: 0.2, editionAgeMa: 201.4, editionUncertaintyMa: 0.2, matches: true },
      { markerId: "2", number: 2, label: "Base of the Paleogene", intervalName: "Paleogene", exhibitAgeMa: 66, exhibitUncertaintyMa: null, editionAgeMa: 66, editionUncertaintyMa: null, matches: true },
    ]);
  });

  it("fails a boundary whose age differs from the pinned edition, one from another edition, and one the edition lacks", () => {
    const moved = { ...jurassic, ageMa: 201.3 };
    const foreign = { ...paleogene };
    const missing = boundary("4", "Cretaceous", { intervalName: "Kreidezeit", label: "Base of the Kreidezeit" });
    const markers = numbered([moved, foreign, missing]);
    const report = runChecks(input({
      markers,
      boundaries: [
        { markerId: "1", intervalName: "Jurassic", editionId: PINNED.id, baseMa: 201.3 },
        { markerId: "2", intervalName: "Paleogene", editionId: PINNED.id + 1, baseMa: 66 },
        { markerId: "4", intervalName: "Kreidezeit", editionId: PINNED.id, baseMa: 143.1 },
      ],
    }));
    expect(report.overall).toBe("fail");
    expect(of(report.results, "boundary-age", "1")[0]).toMatchObject({ status: "fail", message: "Marker 1 (“Base of the Jurassic”) is at 201.3 Ma, but on ICS 2024/12 the base of the Jurassic is 201.4 Ma." });
    expect(of(report.results, "boundary-age", "2")[0].message).toBe("Marker 3 (“Base of the Paleogene”) uses the Paleogene of another chart edition; on ICS 2024/12 its base is 66 Ma. Re-add the marker from the pinned edition.");
    expect(of(report.results, "boundary-age", "4")[0].message).toBe("Marker 2 (“Base of the Kreidezeit”): the Kreidezeit is not an interval of ICS 2024/12, the pinned edition.");
    expect(report.figures.map((f) => [f.markerId, f.matches, f.editionAgeMa])).toEqual([["1", false, 201.4], ["4", false, null], ["2", false, 66]]);
    expect(failuresInWords(report, 2)).toMatch(/^Marker 1 .* Marker 2 .* \(and 1 more\)$/);
  });

  it("fails an event or custom age without a usable source, naming the reason", () => {
    const cases: [string, RegExp][] = [
      ["", /this custom age has no source\. Give the publication the age comes from\.$/],
      ["TBD", /gives “TBD” as its source, which is a placeholder, not a source/],
      ["citation needed", /placeholder/],
      ["Smith", /gives “Smith” as its source, too short to name who published the age and where/],
    ];
    for (const [source, reason] of cases) {
      const report = runChecks(input({ markers: [custom("9", "Coal forest", 310, { source })] }));
      const [r] = of(report.results, "source", "9");
      expect(r.status, source).toBe("fail");
      expect(r.message).toMatch(reason);
    }
    const event = runChecks(input({ markers: [custom("9", "First land plants", 470, { kind: "event", source: "" })] }));
    expect(of(event.results, "source", "9")[0].message).toBe("Marker 1 (“First land plants”): this library event has no source. Give the publication the age comes from.");
  });

  it("fails a marker outside the span, and an exhibit that does not compute", () => {
    const old = custom("8", "Oldest zircon", 4404, { source: "Wilde et al. (2001) Nature 409: 175–178" });
    const report = runChecks(input({ markers: [jurassic, old] }));
    expect(of(report.results, "inside-span", "8")[0]).toMatchObject({ status: "fail", message: "Marker 1 (“Oldest zircon”) is at 4.404 Ga, outside the exhibit's span (541 Ma to 0 a)." });
    expect(of(report.results, "inside-span", "1")[0].status).toBe("pass");

    const broken = runChecks(input({ spec: rope({ medium: { kind: "length", mediumType: "rope", length: { value: 0, unit: "m" }, panelWidth: null } }) }));
    const [computes] = of(broken.results, "computes");
    expect(computes.status).toBe("fail");
    expect(computes.message).toMatch(/^The exhibit does not compute: /);
  });

  it("warns about crowded markers until the warning is acknowledged with a reason, by the engine's key", () => {
    const a = custom("5", "Ash bed A", 100.0, { source: "Field notes, Marrow quarry survey 2021" });
    const b = custom("6", "Ash bed B", 100.001, { source: "Field notes, Marrow quarry survey 2021" });
    const open = runChecks(input({ markers: [a, b] }));
    const [warning] = of(open.results, "legibility").filter((r) => r.status === "warning");
    expect(warning.status).toBe("warning");
    expect(warning.markerId).toBe("6"); // the older of the two comes first
    expect(warning.message).toMatch(/Resolve it \(an inset, fewer markers\) or acknowledge it with a reason\.$/);
    expect(warning.warningKey).toBe("markers-too-close:5,6");
    expect(warning.message).toMatch(/^Markers 1 “Ash bed B” and 2 “Ash bed A” are as little as 0\.1 mm apart/);
    expect(open.overall).toBe("warning");

    const acknowledged = runChecks(input({ markers: [a, b], acknowledgements: [...DURATIONS_ACKNOWLEDGED, { warningKey: warning.warningKey!, reason: "Both beds share one sign on purpose.", by: "Dev", at: "2026-12-01T10:00:00Z" }] }));
    const [ok] = of(acknowledged.results, "legibility", "6");
    expect(ok.status).toBe("pass");
    expect(ok.message).toMatch(/^Acknowledged: .* Reason given: “Both beds share one sign on purpose\.”\.$/);
    expect(ok.acknowledgement).toMatchObject({ reason: "Both beds share one sign on purpose.", by: "Dev" });
    expect(acknowledged.overall).toBe("pass");
    // An acknowledgement of another warning changes nothing.
    expect(runChecks(input({ markers: [a, b], acknowledgements: [...DURATIONS_ACKNOWLEDGED, { warningKey: "markers-too-close:1,2", reason: "x", by: null, at: "" }] })).overall).toBe("warning");
    // Without any acknowledgement, the comparisons too small to see warn as well (no marker named).
    const bare = runChecks(input({ acknowledgements: [] }));
    expect(of(bare.results, "legibility").map((r) => [r.status, r.warningKey, r.markerId])).toEqual([
      ["warning", "duration-too-small:life", null],
      ["warning", "duration-too-small:writing", null],
      ["warning", "duration-too-small:holocene", null],
    ]);
  });

  it("fails an inset whose label does not state its magnification, passes one that does", () => {
    const inset = (label: string) => ({ id: "inset-1", label, olderMa: 0.3, youngerMa: 0, magnification: 1000 });
    const silent = runChecks(input({ spec: rope({ insets: [inset("Our species")] }) }));
    expect(of(silent.results, "inset-magnification")[0]).toMatchObject({ status: "fail", message: "Inset “Our species” does not state its magnification: add “1,000×” to its label so visitors know it is not to the main scale." });
    const stated = runChecks(input({ spec: rope({ insets: [inset("Our species, 1,000× larger")] }) }));
    expect(of(stated.results, "inset-magnification")[0]).toMatchObject({ status: "pass", message: "Inset “Our species, 1,000× larger” states its magnification (1,000×)." });
  });

  it("warns when a marker's text names an interval its age is not in on the pinned edition", () => {
    const wrong = custom("7", "Middle Devonian reef", 300, { source: "Marrow valley guide, 2nd edition, p. 14" });
    const right = custom("8", "Middle Devonian reef", 390, { source: "Marrow valley guide, 2nd edition, p. 14" });
    const report = runChecks(input({ markers: [wrong] }));
    const [w] = of(report.results, "interval-names", "7");
    expect(w.status).toBe("warning");
    expect(w.message).toMatch(/^Marker 1 \(“Middle Devonian reef”\): .*Middle Devonian.*ICS 2024\/12/);
    expect(of(runChecks(input({ markers: [right] })).results, "interval-names", "8")[0]).toMatchObject({ status: "pass", message: "Marker 1 (“Middle Devonian reef”): no interval it names contradicts its age on ICS 2024/12." });
    // The text and the library event's words count too.
    const inText = runChecks(input({ markers: [custom("7", "Reef", 300, { text: "A reef of the Middle Devonian sea." })] }));
    expect(of(inText.results, "interval-names", "7")[0].status).toBe("warning");
    const inEvent = runChecks(input({ markers: [custom("7", "Reef", 300, { kind: "event" })], events: new Map([["7", { name: "Reef", summary: null, datingMethod: "biostratigraphy, late Carnian conodonts" }]]) }));
    expect(of(inEvent.results, "interval-names", "7")[0].status).toBe("warning");
  });

  it("fails an image without alt text (only when images exist)", () => {
    const none = runChecks(input());
    expect(of(none.results, "image-alt")).toEqual([]);
    const report = runChecks(input({ images: new Map([["3", { alt: "  " }], ["1", { alt: "An ammonite shell, grey-blue, with fine ribs." }], ["99", { alt: null }]]) }));
    expect(of(report.results, "image-alt", "3")[0]).toMatchObject({ status: "fail", message: "Marker 3 (“Village mill built”): its image has no alt text; describe what it shows for visitors who cannot see it." });
    expect(of(report.results, "image-alt", "1")[0]).toMatchObject({ status: "pass", message: "Marker 1 (“Base of the Jurassic”): its image has alt text (“An ammonite shell, grey-blue, with fine ribs.”)." });
    expect(of(report.results, "image-alt")).toHaveLength(2); // an image of a marker that is gone is not checked
  });

  it("says “needs re-check” when the organisation's current edition is another one", () => {
    const report = runChecks(input({ recheck: { edition: { slug: "ics-2025-06", label: "ICS 2025/06" }, moved: 2, missing: 1 } }));
    const [r] = of(report.results, "edition-current");
    expect(r.status).toBe("warning");
    expect(r.message).toBe("Needs re-check: your organisation now works with ICS 2025/06, but this exhibit is pinned to ICS 2024/12. Re-pinning would move 2 boundary markers and 1 marker has no matching interval; see the impact report on the exhibit page.");
    expect(report.recheck).toEqual({ edition: { slug: "ics-2025-06", label: "ICS 2025/06" }, moved: 2, missing: 1 });
    expect(report.overall).toBe("warning");
  });

  it("counts every result once", () => {
    const report = runChecks(input({ markers: [jurassic, custom("9", "Coal forest", 310, { source: "" })] }));
    expect(report.counts.pass + report.counts.warning + report.counts.fail).toBe(report.results.length);
    expect(failuresInWords(report)).toBe(of(report.results, "source", "9")[0].message);
  });
});

describe("check helpers", () => {
  it("sourceProblem: empty, placeholder, too short, or fine", () => {
    expect(sourceProblem(null)).toBe("has no source");
    expect(sourceProblem("   ")).toBe("has no source");
    for (const p of ["n/a", "N/A", "???", "see above", "Reference", "-"]) expect(sourceProblem(p), p).toMatch(/placeholder/);
    expect(sourceProblem("x".repeat(MIN_SOURCE_LENGTH - 1))).toMatch(/placeholder|too short/);
    expect(sourceProblem("Ogg 2020")).toBeNull();
    expect(MIN_SOURCE_LENGTH).toBe(8);
  });

  it("statesMagnification: the figure followed by ×, x or times, with or without thousands separators", () => {
    expect(statesMagnification("last 10,000 years at 1,000×", 1000)).toBe(true);
    expect(statesMagnification("1000 x", 1000)).toBe(true);
    expect(statesMagnification("1 000 times larger", 1000)).toBe(true);
    expect(statesMagnification("2.5× enlarged", 2.5)).toBe(true);
    expect(statesMagnification("100× enlarged", 1000)).toBe(false);
    expect(statesMagnification("10,000 years", 1000)).toBe(false);
    expect(statesMagnification("enlarged", 1000)).toBe(false);
  });

  it("warningKeyOf: the engine's key, else code and ids", () => {
    expect(warningKeyOf({ code: "markers-same-age", key: "markers-same-age:3,4", message: "", pointIds: ["3", "4"], markers: [] } as never)).toBe("markers-same-age:3,4");
    expect(warningKeyOf({ code: "duration-too-small", message: "", pointIds: [], durationIds: ["life"], markers: [] } as never)).toBe("duration-too-small:life");
  });
});
