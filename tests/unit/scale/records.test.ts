// The preview's per-marker results are made by constructors (records.ts) but must stay plain
// objects: JSON, structuredClone and React Router's data encoding (which refuses an object whose
// prototype is not Object.prototype) see what object literals would give.
import { describe, expect, it } from "vitest";
import { computeExhibit, standardDurations } from "../../../app/lib/exhibit/index.ts";
import { plainRecord } from "../../../app/lib/scale/records.ts";
import { demoExhibits } from "./demo-exhibits.ts";

const isPlain = (x: unknown) => typeof x === "object" && x !== null && Object.getPrototypeOf(x) === Object.prototype;

describe("plain records", () => {
  it("plainRecord makes objects with Object.prototype and their own fields only", () => {
    const Pair = plainRecord(function (this: { a: number; b?: string }, a: number, b?: string) {
      this.a = a;
      if (b !== undefined) this.b = b;
    });
    const x = new Pair(1, "two");
    expect(Object.getPrototypeOf(x)).toBe(Object.prototype);
    expect(x.constructor).toBe(Object);
    expect(x).toStrictEqual({ a: 1, b: "two" });
    expect(new Pair(3)).toStrictEqual({ a: 3 });
    expect(Object.keys(new Pair(3))).toEqual(["a"]);
    expect(structuredClone(x)).toStrictEqual({ a: 1, b: "two" });
  });

  it("every point, label, place, walking figure and inset placement of the demo exhibits is plain, with its fields in the documented order", () => {
    let routes = 0;
    for (const demo of demoExhibits()) {
      const r = computeExhibit(demo.spec, demo.markers, standardDurations(80));
      if (!r.ok) throw new Error(demo.slug);
      for (const p of r.result.points) {
        for (const part of [p, p.display, p.position, p.walking, ...p.insets, ...p.insets.map((i) => i.display)]) if (part !== undefined) expect(isPlain(part), demo.slug).toBe(true);
        const keys = ["id", "number", "ageYears", "uncertaintyYears", "fromOlderEndMetres", "fromYoungerEndMetres", "uncertaintyMetres", "display", "insets"];
        if (p.position) keys.push("position", "bearing", "walking");
        if (p.label !== undefined) keys.push("label");
        expect(Object.keys(p)).toEqual(keys);
        expect(Object.keys(p.display)).toEqual(["fromOlderEnd", "fromYoungerEnd", "uncertainty", "stepMetres", "basis"]);
        if (p.walking) expect(Object.keys(p.walking)).toEqual(["distanceFromStartMetres", "seconds", "accessibleSeconds", "steps", "stepsUpTo", "text"]);
      }
      if (r.result.points.some((p) => p.position)) routes++;
      // a round trip through JSON gives the same result
      expect(JSON.parse(JSON.stringify(r.result))).toStrictEqual(JSON.parse(JSON.stringify(structuredClone(r.result))));
    }
    expect(routes).toBeGreaterThan(0);
  });
});
