// The comparisons' words: "an 80-year life", not "a 80-year life".
import { describe, expect, it } from "vitest";
import { articleFor, standardDurations } from "../../../app/lib/exhibit/index.ts";

describe("the article before a life span in years", () => {
  it("follows how the number is read aloud (common practice of English usage)", () => {
    // an: eight…, eleven…, eighteen…, eighty…, eight hundred…, eleven thousand, eighteen thousand
    for (const n of [8, 11, 18, 80, 85, 89, 800, 8000, 11_000, 18_000, 11_000_000]) expect(articleFor(n), String(n)).toBe("an");
    // a: one hundred ten, one hundred eighty, one thousand one hundred, seven, seventy-nine, one hundred
    for (const n of [1, 7, 79, 100, 110, 180, 1100, 1800, 110_000, 5]) expect(articleFor(n), String(n)).toBe("a");
  });

  it("names the life comparison with it", () => {
    expect(standardDurations(80)[0].label).toBe("an 80-year life");
    expect(standardDurations(75)[0].label).toBe("a 75-year life");
    expect(standardDurations(18)[0].label).toBe("an 18-year life");
  });
});
