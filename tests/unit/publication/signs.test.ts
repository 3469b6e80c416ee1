// Sign numbers: given at a marker's first publication and kept; numbers of markers that are gone are
// retired (absorbed by the marker left at the same age, else removed) and never given again.
import { describe, expect, it } from "vitest";
import { planSigns, type StoredSign } from "../../../app/lib/publication/signs.ts";

const m = (id: string, ageMa: number, label = `Marker ${id}`) => ({ id, label, ageMa });

/** What the server stores after a plan (marker_signs rows). */
function store(signs: StoredSign[], plan: ReturnType<typeof planSigns>, publication: number): StoredSign[] {
  const retired = new Map(plan.retired.map((r) => [r.number, r]));
  return [
    ...signs.map((s) => (retired.has(s.number) ? { ...s, retiredAtPublication: publication, absorbedByNumber: retired.get(s.number)!.absorbedByNumber } : s)),
    ...plan.created.map((c) => ({ number: c.number, markerId: c.markerId, label: c.label, retiredAtPublication: null, absorbedByNumber: null })),
  ];
}

describe("planSigns", () => {
  it("first publication: 1…N in table order from the older end, nothing retired", () => {
    const plan = planSigns([m("a", 500), m("b", 300), m("c", 66)], [], 1);
    expect([...plan.numbers]).toEqual([["a", 1], ["b", 2], ["c", 3]]);
    expect(plan.created).toEqual([{ markerId: "a", number: 1, label: "Marker a" }, { markerId: "b", number: 2, label: "Marker b" }, { markerId: "c", number: 3, label: "Marker c" }]);
    expect(plan.retired).toEqual([]);
    expect(plan.retiredSigns).toEqual([]);
  });

  it("later publications: kept numbers stay, new markers get numbers after every number ever used, a removed marker's number is retired", () => {
    const first = planSigns([m("a", 500), m("b", 300), m("c", 66)], [], 1);
    let signs = store([], first, 1);
    // Publication 2: "c" removed, "d" added older than everything: it still gets 4, not 1 or 3.
    const second = planSigns([m("d", 520), m("a", 500), m("b", 300)], signs, 2, new Map([["c", 66]]));
    expect([...second.numbers]).toEqual([["d", 4], ["a", 1], ["b", 2]]);
    expect(second.created).toEqual([{ markerId: "d", number: 4, label: "Marker d" }]);
    expect(second.retired).toEqual([{ number: 3, absorbedByNumber: null }]);
    expect(second.retiredSigns).toEqual([{ number: 3, label: "Marker c", retiredAtPublication: 2, status: "removed", absorbedBy: null }]);
    signs = store(signs, second, 2);

    // Publication 3: the highest number (4) is retired; the next new marker gets 5, never 4 again.
    const third = planSigns([m("a", 500), m("b", 300), m("e", 1)], signs, 3, new Map([["d", 520]]));
    expect(third.numbers.get("e")).toBe(5);
    expect(third.retired).toEqual([{ number: 4, absorbedByNumber: null }]);
    // Earlier retired signs are carried forward, in number order.
    expect(third.retiredSigns.map((s) => [s.number, s.retiredAtPublication, s.status])).toEqual([[3, 2, "removed"], [4, 3, "removed"]]);
  });

  it("combined markers: the gone marker's sign is absorbed by the one left at the same age", () => {
    const signs = store([], planSigns([m("a", 201.4, "Base of the Jurassic"), m("b", 201.4, "Base of the Mesozoic"), m("c", 66)], [], 1), 1);
    const plan = planSigns([m("a", 201.4, "Base of the Jurassic and Mesozoic"), m("c", 66)], signs, 2, new Map([["b", 201.4]]));
    expect(plan.retired).toEqual([{ number: 2, absorbedByNumber: 1 }]);
    expect(plan.retiredSigns).toEqual([{ number: 2, label: "Base of the Mesozoic", retiredAtPublication: 2, status: "absorbed", absorbedBy: 1 }]);
    expect(plan.created).toEqual([]);
  });

  it("a gone marker whose age is unknown is removed, not absorbed", () => {
    const signs = store([], planSigns([m("a", 100), m("b", 100)], [], 1), 1);
    expect(planSigns([m("a", 100)], signs, 2).retired).toEqual([{ number: 2, absorbedByNumber: null }]);
  });

  it("a marker whose sign was retired keeps that number if it comes back (no second number)", () => {
    const signs: StoredSign[] = [
      { number: 1, markerId: "a", label: "A", retiredAtPublication: null, absorbedByNumber: null },
      { number: 2, markerId: "b", label: "B", retiredAtPublication: 2, absorbedByNumber: null },
    ];
    const plan = planSigns([m("a", 10), m("b", 5)], signs, 3);
    expect(plan.numbers.get("b")).toBe(2);
    expect(plan.created).toEqual([]);
  });
});
