// Why an exhibit does not compute, as the composer's preview, a refused save and the review checks
// say it: fields by their labels, markers by table number and label, insets by name — never the
// engine's request paths, database ids or ages in years. Expected texts are written out here.
// The markers and exhibits are invented for the tests.
import { describe, expect, it } from "vitest";
import { computeExhibit, exhibitProblem, type ExhibitSpec, type ResolvedMarker } from "../../../app/lib/exhibit/index.ts";
import { custom, rope as ropeOf } from "../review/fixture.ts";

const rope = ropeOf(); // 541 Ma to the present on a 54.1 m rope

/** A custom marker with a database-like id (never shown) and its table number. */
const marker = (id: string, number: number, label: string, ageMa: number): ResolvedMarker => custom(id, label, ageMa, { number });

const hadean = marker("138", 1, "Oldest rock grains", 4404);
const cambrian = marker("140", 2, "First shelly fossils", 538.8);
const boathouse = marker("141", 3, "Boathouse built", 0.00015);

/** The message computeExhibit gives, after checking that it failed and that the engine's paths are still in its issues. */
function problem(spec: ExhibitSpec, markers: ResolvedMarker[]): string {
  const r = computeExhibit(spec, markers);
  if (r.ok) throw new Error("expected the exhibit not to compute");
  expect(r.issues.length).toBeGreaterThan(0);
  expect(r.message).not.toMatch(/\bpoints\.\d|\bspan\.(older|younger)|\binsets\.\d|Invalid request|\d years\)/);
  return r.message;
}

describe("an exhibit that does not compute, in the composer's words", () => {
  it("names a marker outside the span by its table number, label and age, with the span as typed", () => {
    expect(problem(rope, [hadean, cambrian, boathouse])).toBe("Marker 1 “Oldest rock grains” (4.404 Ga) lies outside the span (541 Ma to the present).");
    const r = computeExhibit(rope, [hadean, cambrian, boathouse]);
    expect(!r.ok && r.issues[0].path).toBe("points.0.age"); // the API's paths stay for those who read them
  });

  it("counts several markers outside the span and names the first six", () => {
    const old = Array.from({ length: 8 }, (_, i) => marker(String(200 + i), i + 1, `Grain ${i + 1}`, 4000 - i * 100));
    expect(problem({ ...rope, spanOlder: { value: 11.7, unit: "ka" } }, [...old, boathouse])).toBe(
      "8 markers lie outside the span (11.7 ka to the present): 1 “Grain 1” (4 Ga), 2 “Grain 2” (3.9 Ga), 3 “Grain 3” (3.8 Ga), 4 “Grain 4” (3.7 Ga), 5 “Grain 5” (3.6 Ga), 6 “Grain 6” (3.5 Ga) and 2 more.",
    );
  });

  it("says which end of the span must be the older one, as typed", () => {
    expect(problem({ ...rope, spanOlder: { value: 0, unit: "Ma" }, spanYounger: { value: 541, unit: "Ma" } }, [])).toBe(
      "The older end (start), the present, must be older than the younger end (finish), 541 Ma.",
    );
  });

  it("asks for a number in an empty or mistyped span field, by the field's label", () => {
    // an emptied field reads as 0 (specOfDraft): then the ends are in the wrong order
    expect(problem({ ...rope, spanOlder: { value: Number(""), unit: "Ma" } }, [])).toBe("The older end (start), the present, must be older than the younger end (finish), the present.");
    expect(problem({ ...rope, spanOlder: { value: Number("5 41"), unit: "Ma" } }, [cambrian])).toBe("Older end (start): type a number.");
    expect(problem({ ...rope, spanYounger: { value: -1, unit: "Ma" } }, [cambrian])).toBe("Younger end (finish): An age must not be negative (ages are years before present).");
    expect(problem({ ...rope, medium: { ...rope.medium, length: { value: 0, unit: "m" } } as ExhibitSpec["medium"] }, [cambrian])).toBe("Length: A length must be greater than zero.");
  });

  it("names an inset outside the span by its label and ages", () => {
    const inset = { id: "inset-3", label: "Dinosaur ends at 100×", olderMa: 66.1, youngerMa: 66, magnification: 100 };
    expect(problem({ ...rope, spanOlder: { value: 60, unit: "Ma" }, insets: [inset] }, [])).toBe("Inset “Dinosaur ends at 100×” (66.1 Ma to 66 Ma): An inset must lie inside the exhibit's span.");
  });

  it("gives the first problem and counts the other kinds", () => {
    const inset = { id: "inset-3", label: "last 10,000 years at 1,000×", olderMa: 0.01, youngerMa: 0, magnification: 1000 };
    const text = problem({ ...rope, spanYounger: { value: 1, unit: "Ma" }, insets: [inset] }, [hadean, boathouse]);
    expect(text).toBe("2 markers lie outside the span (541 Ma to 1 Ma): 1 “Oldest rock grains” (4.404 Ga) and 3 “Boathouse built” (150 a). (And 1 more problem.)");
  });

  it("falls back to the engine's reason for a problem it has no words of its own for", () => {
    expect(exhibitProblem(rope, [], [{ path: "durations.0.id", message: 'Duplicate duration id "life".' }])).toBe('Duplicate duration id "life".');
    expect(exhibitProblem(rope, [], [])).toBe("The exhibit's settings cannot be worked out.");
  });
});
