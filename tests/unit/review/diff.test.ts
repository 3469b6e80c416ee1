// Revision contents (what exhibit_revisions.content keeps) and the difference of two: markers added,
// removed, moved in the exhibit's own units, rewritten; settings changed.
import { describe, expect, it } from "vitest";
import type { ExhibitSpec, ResolvedMarker } from "../../../app/lib/exhibit/types.ts";
import { revisionContent } from "../../../app/lib/review/content.ts";
import { diffRevisions } from "../../../app/lib/review/diff.ts";
import { boundary, custom, numbered, PINNED, rope } from "./fixture.ts";

const edition = { id: PINNED.id, slug: PINNED.slug, label: PINNED.label };
const content = (markers: ResolvedMarker[], spec: ExhibitSpec = rope(), title = "Deep-time rope") =>
  revisionContent({ title, slug: "deep-time-rope", edition, spec, markers: numbered(markers), decaySystems: new Map([["3", 2]]), medium: { vertexCount: null, geometrySha256: null } });

const jurassic = boundary("1", "Jurassic");
const paleogene = boundary("2", "Paleogene");
const reef = custom("3", "Reef", 390, { text: "A warm sea covered the valley." });

describe("revisionContent", () => {
  it("keeps the whole exhibit at one revision: settings, medium, markers with their sources and panels, insets", () => {
    const c = content([jurassic, reef], rope({ insets: [{ id: "inset-1", label: "Our species, 1,000×", olderMa: 0.3, youngerMa: 0, magnification: 1000 }] }));
    expect(c).toMatchObject({ title: "Deep-time rope", slug: "deep-time-rope", edition, spanOlder: { value: 541, unit: "Ma" }, spanYounger: { value: 0, unit: "Ma" }, unitsPreference: "metric" });
    expect(c.medium).toEqual({ kind: "length", mediumType: "rope", lengthValue: 54.1, lengthUnit: "m", panelWidthValue: null, panelWidthUnit: null, routeLengthM: null, routeVertexCount: null, sourceName: null, geometrySha256: null });
    expect(c.markers.map((m) => [m.id, m.kind, m.ageMa, m.decaySystemId])).toEqual([["3", "custom", 390, 2], ["1", "boundary", 201.4, null]]);
    expect(c.markers[1]).toMatchObject({ intervalName: "Jurassic", uncertaintyMa: 0.2, source: "ICS 2024/12" });
    expect(c.insets).toEqual([{ id: "inset-1", label: "Our species, 1,000×", olderMa: 0.3, youngerMa: 0, magnification: 1000 }]);
  });

  it("a route keeps its length, vertex count, file name and geometry hash (not the geometry)", () => {
    const route: ExhibitSpec = rope({ medium: { kind: "route", mediumType: "trail", geometry: { type: "LineString", coordinates: [[-1.5, 54.0], [-1.49, 54.0]] }, lengthMetres: 655.4, sourceName: "riverside.gpx" } });
    const c = revisionContent({ title: "Walk", slug: "walk", edition, spec: route, markers: [], decaySystems: new Map(), medium: { vertexCount: 2, geometrySha256: "ab".repeat(32) } });
    expect(c.medium).toEqual({ kind: "route", mediumType: "trail", lengthValue: null, lengthUnit: null, panelWidthValue: null, panelWidthUnit: null, routeLengthM: 655.4, routeVertexCount: 2, sourceName: "riverside.gpx", geometrySha256: "ab".repeat(32) });
  });
});

describe("diffRevisions", () => {
  it("no differences between a revision and itself", () => {
    const c = content([jurassic, paleogene, reef]);
    expect(diffRevisions(c, c)).toEqual({ added: [], removed: [], changed: [], settings: [], unchanged: 3 });
  });

  it("added with its age and position, removed with its age", () => {
    const diff = diffRevisions(content([jurassic, reef]), content([jurassic, paleogene]));
    // 1 m per 10 million years: the base of the Paleogene (66 Ma) is (541 − 66) / 10 = 47.5 m from the older end.
    expect(diff.added).toEqual([{ id: "2", label: "Base of the Paleogene", ageText: "66 Ma", position: "47.500 m from the older end" }]);
    expect(diff.removed).toEqual([{ id: "3", label: "Reef", ageText: "390 Ma" }]);
    expect(diff.unchanged).toBe(1);
  });

  it("a moved marker: how far and which way in the exhibit's units, with the age change", () => {
    const later = { ...reef, ageMa: 385, uncertaintyMa: 2 };
    const [change] = diffRevisions(content([reef]), content([later])).changed;
    // 5 million years younger = 50 cm towards the younger end: 15.1 m → 15.6 m.
    expect(change).toEqual({ id: "3", label: "Reef", changes: ["moved 50.0 cm towards the younger end (15.100 m → 15.600 m from the older end)", "age 390 Ma → 385 Ma ± 2 Ma"] });
    const us = rope({ unitsPreference: "us" });
    const [inFeet] = diffRevisions(content([reef], us), content([later], us)).changed;
    expect(inFeet.changes[0]).toMatch(/^moved 1\.\d+ ft towards the younger end \(49\.\d+ ft → 51\.\d+ ft from the older end\)$/);
  });

  it("a longer rope moves every marker without changing its age", () => {
    // (541 − 201.4) / 10 = 33.96 m on 54.1 m; twice that on 108.2 m.
    const diff = diffRevisions(content([jurassic]), content([jurassic], rope({ medium: { kind: "length", mediumType: "rope", length: { value: 108.2, unit: "m" }, panelWidth: null } })));
    expect(diff.changed[0].changes).toEqual(["moved 33.960 m towards the younger end (33.960 m → 67.920 m from the older end)"]);
    expect(diff.settings).toEqual(["medium 54.1 m rope → 108.2 m rope"]);
  });

  it("label, text, source and “how we know” panel changes in words", () => {
    const before = content([reef]);
    const after = revisionContent({
      title: "Deep-time rope",
      slug: "deep-time-rope",
      edition,
      spec: rope(),
      markers: numbered([{ ...reef, label: "Devonian reef", text: "A coral reef grew here.", source: "Marrow valley guide, 3rd edition, p. 9" }]),
      decaySystems: new Map(),
      medium: { vertexCount: null, geometrySha256: null },
    });
    expect(diffRevisions(before, after).changed[0].changes).toEqual([
      "label “Reef” → “Devonian reef”",
      "text rewritten",
      `source “${reef.source}” → “Marrow valley guide, 3rd edition, p. 9”`,
      "“how we know” panel removed",
    ]);
    const noText = content([{ ...reef, text: "" }]);
    expect(diffRevisions(before, noText).changed[0].changes).toEqual(["text removed"]);
    expect(diffRevisions(noText, before).changed[0].changes).toEqual(["text added"]);
  });

  it("settings: title, span, edition, units, insets, legibility", () => {
    const a = content([jurassic]);
    const b = revisionContent({
      title: "Phanerozoic rope",
      slug: "deep-time-rope",
      edition: { id: 8, slug: "ics-2023-09", label: "ICS 2023/09" },
      spec: rope({ spanOlder: { value: 538.8, unit: "Ma" }, unitsPreference: "us", legibility: { minSpacingMetres: 0.2 }, insets: [{ id: "inset-1", label: "Holocene, 100×", olderMa: 0.0117, youngerMa: 0, magnification: 100 }] }),
      markers: numbered([jurassic]),
      decaySystems: new Map(),
      medium: { vertexCount: null, geometrySha256: null },
    });
    expect(diffRevisions(a, b).settings).toEqual([
      "title “Deep-time rope” → “Phanerozoic rope”",
      "span 541 Ma to 0 Ma → 538.8 Ma to 0 Ma",
      "chart edition ICS 2024/12 → ICS 2023/09",
      "units metric → us",
      "insets “none” → “Holocene, 100×”",
      "legibility thresholds changed",
    ]);
  });
});
