// The composer's pure parts: the one schema over its forms, resolving marker ages, the list's
// filters and order, and slugs. Expected values are written out here, not read from the code.
import { describe, expect, it } from "vitest";
import { ComposerCommandSchema, exhibitListQuery, filterAndSortExhibits, resolveMarkers, type ExhibitListRow, type MarkerRecord } from "../../../app/lib/exhibit/index.ts";
import { slugify } from "../../../app/lib/slug.ts";
import type { Interval } from "../../../app/lib/timescale/types.ts";
import { parseForm } from "../../../app/lib/validation.ts";

function form(fields: Record<string, string | File>) {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

const settings = { intent: "settings", revision: "4", title: "Wall", spanOlderValue: "541", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric" };

describe("the composer's command schema", () => {
  it("reads each intent into its own typed command", () => {
    expect(parseForm(ComposerCommandSchema, form({ ...settings, mediumKind: "length", lengthValue: "5.41", lengthUnit: "m" }))).toEqual({
      ok: true,
      data: { intent: "settings", revision: 4, mediumKind: "length", title: "Wall", spanOlderValue: 541, spanOlderUnit: "Ma", spanYoungerValue: 0, spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric", lengthValue: 5.41, lengthUnit: "m" },
    });
    expect(parseForm(ComposerCommandSchema, form({ intent: "remove-inset", revision: "2", insetId: "inset-17" }))).toEqual({ ok: true, data: { intent: "remove-inset", revision: 2, insetId: 17 } });
    expect(parseForm(ComposerCommandSchema, form({ intent: "repin", revision: "9" }))).toEqual({ ok: true, data: { intent: "repin", revision: 9 } });
    const file = new File(["<gpx/>"], "walk.gpx");
    const route = parseForm(ComposerCommandSchema, form({ intent: "replace-route", revision: "3", routeFile: file }));
    expect(route.ok && route.data.intent === "replace-route" && route.data.routeFile.name).toBe("walk.gpx");
  });

  it.each([
    [{ intent: "rename-everything", revision: "1" }, "intent", "Unknown action."],
    [{ intent: "repin" }, "revision", "The form lost its revision number; reload the page."],
    [{ ...settings }, "mediumKind", "The settings form lost its medium kind; reload the page."],
    [{ ...settings, mediumKind: "length", lengthValue: "0", lengthUnit: "m" }, "lengthValue", "The length must be greater than zero."],
    [{ ...settings, mediumKind: "route", spanOlderValue: "0" }, "spanOlderValue", "The older end of the span must be older than the younger end."],
    [{ intent: "remove-marker", revision: "1", markerId: "x" }, "markerId", "Missing marker."],
    [{ intent: "replace-route", revision: "1", routeFile: new File([], "empty.gpx") }, "routeFile", "Upload the new route as a GeoJSON or GPX file."],
    [{ intent: "add-boundaries", revision: "1", intervalName: "Cambrian", rank: "period" }, "intervalName", "Choose one interval, or a whole rank (e.g. all periods)."],
  ])("refuses %o on %s", (fields, field, message) => {
    const r = parseForm(ComposerCommandSchema, form(fields as Record<string, string | File>));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fieldErrors[field]).toBe(message);
  });
});

describe("resolveMarkers", () => {
  const iv = (name: string, baseMa: number, topMa: number, extra: Partial<Interval> = {}): Interval =>
    ({ name, rank: "period", parent: null, baseMa, baseUncertaintyMa: null, topMa, color: "#7FA056", gssp: true, boundaryKind: "GSSP", approximate: false, names: {}, order: 1, ...extra });
  const cambrian = iv("Cambrian", 538.8, 486.85, { baseUncertaintyMa: 0.6 });
  const ordovician = iv("Ordovician", 486.85, 443.1, { color: "#009270" });
  const row = (id: number, fields: Partial<MarkerRecord>): MarkerRecord => ({ id, kind: "custom", label: `m${id}`, text: "", intervalId: null, datedEventId: null, ageMa: null, uncertaintyMa: null, source: null, ...fields });

  it("takes a boundary's age from the edition, an event's from the library, and numbers markers from the older end", () => {
    const markers = resolveMarkers(
      [row(1, { ageMa: "0.00015", uncertaintyMa: "0.00001", source: "Estate records" }), row(2, { kind: "event", datedEventId: 7 }), row(3, { kind: "boundary", intervalId: 11 })],
      new Map([[11, cambrian]]),
      new Map([[7, { name: "Oldest zircon", ageMa: 4404, uncertaintyMa: 8, citation: "Wilde et al. (2001)" }]]),
      [cambrian, ordovician],
      { slug: "ics-2024-12", label: "ICS 2024/12" },
    );
    expect(markers.map((m) => [m.number, m.id, m.ageMa, m.uncertaintyMa, m.source])).toEqual([
      [1, "2", 4404, 8, "Wilde et al. (2001)"],
      [2, "3", 538.8, 0.6, "ICS 2024/12: base of the Cambrian (GSSP)"],
      [3, "1", 0.00015, 0.00001, "Estate records"],
    ]);
    expect(markers[1]).toMatchObject({ intervalName: "Cambrian", intervalRank: "period", eventName: null });
  });

  it("refuses a boundary whose interval is not in the pinned edition", () => {
    expect(() => resolveMarkers([row(5, { kind: "boundary", intervalId: 99 })], new Map(), new Map(), [], { slug: "ics-2023-09", label: "ICS 2023/09" })).toThrow("marker 5: interval 99 is not in ics-2023-09");
  });
});

describe("the exhibit list", () => {
  const row = (slug: string, fields: Partial<ExhibitListRow>): ExhibitListRow => ({ slug, title: slug, medium: "wall", metres: 1, length: "1 m", edition: "ICS 2024/12", needsRecheck: false, status: "draft", revision: 1, markers: 0, updated: "2026-01-01T00:00:00.000Z", updatedBy: null, ...fields });
  const rows = [
    row("corridor", { title: "The corridor", metres: 18, needsRecheck: true, updated: "2026-03-01T00:00:00.000Z" }),
    row("riverside", { title: "Riverside walk", medium: "route (trail)", metres: 4567, updated: "2026-02-01T00:00:00.000Z" }),
    row("rope", { title: "School rope", medium: "rope", metres: 46, updated: "2026-04-01T00:00:00.000Z" }),
  ];
  const slugs = (q: string) => filterAndSortExhibits(rows, exhibitListQuery(new URLSearchParams(q))).map((r) => r.slug);

  it("shows the most recently saved first unless asked otherwise", () => {
    expect(slugs("")).toEqual(["rope", "corridor", "riverside"]);
    expect(slugs("sort=length")).toEqual(["corridor", "rope", "riverside"]);
    expect(slugs("sort=length&dir=desc")).toEqual(["riverside", "rope", "corridor"]);
    expect(slugs("sort=title")).toEqual(["riverside", "rope", "corridor"]);
    expect(slugs("sort=nonsense")).toEqual(["rope", "corridor", "riverside"]);
  });

  it("filters by title, medium and re-check", () => {
    expect(slugs("q=RIVER")).toEqual(["riverside"]);
    expect(slugs("medium=route")).toEqual(["riverside"]);
    expect(slugs("recheck=1")).toEqual(["corridor"]);
  });
});

describe("slugify", () => {
  it("makes web addresses from titles in any Latin script", () => {
    expect(slugify("Riverside walk through deep time")).toBe("riverside-walk-through-deep-time");
    expect(slugify("Érosion & Zachełmie — Łódź")).toBe("erosion-zachelmie-lodz");
    expect(slugify("  ---  ")).toBe("");
    expect(slugify("a long title for a short address", 12)).toBe("a-long-title");
  });
});
