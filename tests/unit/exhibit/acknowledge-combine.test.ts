// The pure halves of acknowledge-warning and combine-markers: the forms, which acknowledgement
// applies to which warning, and what combining same-age markers makes.
import { describe, expect, it } from "vitest";
import { acknowledgementOf, ComposerCommandSchema, isAcknowledged, planCombine, withAcknowledgements, type ResolvedMarker, type WarningAcknowledgement } from "../../../app/lib/exhibit/index.ts";
import type { ScaleWarning } from "../../../app/lib/scale/index.ts";
import { parseForm } from "../../../app/lib/validation.ts";

const marker = (id: string, number: number, fields: Partial<ResolvedMarker>): ResolvedMarker =>
  ({ id, number, kind: "boundary", label: `m${id}`, text: "", ageMa: 4031, uncertaintyMa: null, intervalName: null, intervalRank: null, eventName: null, source: "", color: "#888888", approximate: false, ...fields });

describe("combine-markers", () => {
  it("keeps the coarsest boundary and labels it with every name, as the demo's shared markers read", () => {
    const plan = planCombine([
      marker("140", 3, { label: "Base of the Eoarchean", intervalName: "Eoarchean", intervalRank: "era", text: "The oldest rocks." }),
      marker("137", 2, { label: "Base of the Archean", intervalName: "Archean", intervalRank: "eon" }),
      marker("150", 4, { kind: "event", label: "Oldest known rocks (Acasta Gneiss)", text: "Canada." }),
    ]);
    expect(plan).toEqual({ ok: true, keepId: "137", removeIds: ["140", "150"], label: "Base of the Archean and Eoarchean; Oldest known rocks (Acasta Gneiss)", text: "The oldest rocks.\n\nCanada." });
  });

  it("refuses markers of different ages, a single marker, and a label over 200 characters", () => {
    expect(planCombine([marker("1", 1, { label: "A" }), marker("2", 2, { label: "B", ageMa: 2500 })])).toEqual({ ok: false, message: "Only markers of the same age can be combined: marker 1 (“A”) and marker 2 (“B”) differ." });
    expect(planCombine([marker("1", 1, {})]).ok).toBe(false);
    const long = planCombine([marker("1", 1, { kind: "custom", label: "x".repeat(120) }), marker("2", 2, { kind: "custom", label: "y".repeat(120) })]);
    expect(long.ok === false && long.message).toMatch(/over the 200 a label may have/);
  });

  it("reads the posted ids, and refuses fewer than two or a repeated id", () => {
    const form = (fields: Record<string, string>) => {
      const f = new FormData();
      for (const [k, v] of Object.entries(fields)) f.set(k, v);
      return f;
    };
    expect(parseForm(ComposerCommandSchema, form({ intent: "combine-markers", revision: "3", markerIds: "137,140" }))).toEqual({ ok: true, data: { intent: "combine-markers", revision: 3, markerIds: [137, 140] } });
    for (const [ids, message] of [["137", /at least two/], ["137,137", /named twice/], ["a,b", /at least two/], ["", /at least two/]] as const) {
      const r = parseForm(ComposerCommandSchema, form({ intent: "combine-markers", revision: "3", markerIds: ids }));
      expect(r.ok === false && r.fieldErrors.markerIds).toMatch(message);
    }
    const ack = parseForm(ComposerCommandSchema, form({ intent: "acknowledge-warning", revision: "3", warningKey: "markers-same-age:137,140", reason: "  The two signs share one post.  " }));
    expect(ack).toEqual({ ok: true, data: { intent: "acknowledge-warning", revision: 3, warningKey: "markers-same-age:137,140", reason: "The two signs share one post." } });
  });
});

describe("acknowledgements", () => {
  const w = (key: string) => ({ key, code: "markers-same-age", message: "", pointIds: [], markers: [] }) as ScaleWarning;
  const ack = (warningKey: string, revision: number, reason = "The two signs share one post."): WarningAcknowledgement => ({ warningKey, reason, by: "Dee Signer", at: "2026-12-03T10:00:00.000Z", revision });

  it("apply by key only; the latest wins; one whose warning is gone is ignored", () => {
    const acks = [ack("markers-same-age:137,140", 4, "first"), ack("markers-same-age:137,140", 6, "second"), ack("markers-same-age:1,2", 5)];
    expect(isAcknowledged(w("markers-same-age:137,140"), acks)).toBe(true);
    expect(acknowledgementOf(w("markers-same-age:137,140"), acks)?.reason).toBe("second");
    expect(isAcknowledged(w("markers-same-age:137,140,141"), acks)).toBe(false); // a third marker joined: a new warning
    const shown = withAcknowledgements([w("markers-same-age:137,140"), w("duration-too-small:life")], acks);
    expect(shown.map((x) => [x.key, x.acknowledgement?.reason ?? null])).toEqual([["markers-same-age:137,140", "second"], ["duration-too-small:life", null]]);
  });
});
