// digits.ts keeps the whole parts of figures it has written (and "± " wholes): every figure must
// still read as toFixed writes it, with thousands separators, whichever was asked first.
import { describe, expect, it } from "vitest";
import { digits, formatFixed } from "../../../app/lib/scale/digits";

/** The reference: toFixed's digits, the whole part grouped by threes, "−" for minus. */
function reference(x: number, d: number): string {
  const s = Math.abs(x).toFixed(d);
  const [whole, frac] = s.split(".");
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return (x < 0 && Number(s) !== 0 ? "−" : "") + grouped + (frac === undefined ? "" : "." + frac);
}

describe("figures from kept whole parts", () => {
  it("formatFixed reads as toFixed around the end of the kept range (99,999 → 100,000) and far from it", () => {
    const wrong: string[] = [];
    for (const base of [0, 7, 999, 1000, 99_990, 99_999, 100_000, 100_001, 4_501_000, 123_456_789]) {
      for (let k = -3; k < 30; k++) {
        for (const d of [1, 2, 3, 5]) {
          const x = base + k * 0.37;
          for (const v of [x, -x]) if (formatFixed(v, d) !== reference(v, d)) wrong.push(`${v} ${d}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });

  it("a ± and a plain figure with the same whole part do not share text", () => {
    // asked in both orders, so neither table can answer for the other
    expect(digits(4_501_25, 2, false, " km", true)).toBe("± 4,501.25 km");
    expect(digits(4_501_25, 2, false, " km")).toBe("4,501.25 km");
    expect(digits(7_05, 2, false, " m")).toBe("7.05 m");
    expect(digits(7_05, 2, false, " m", true)).toBe("± 7.05 m");
    expect(digits(123_456_789_0, 1, false, " ft", true)).toBe("± 123,456,789.0 ft");
    expect(digits(12_345_678, 4, false, " m", true)).toBe("± 1,234.5678 m");
    expect(digits(12_0, 1, true, " m", true)).toBe("± −12.0 m");
    expect(digits(5, 0, false, " cm", true)).toBe("± 5 cm");
  });

  it("any suffix reads right, the unit words kept and others (past 16) written afresh", () => {
    for (let i = 0; i < 24; i++) expect(digits(1_234_05, 2, false, ` unit${i}`)).toBe(`1,234.05 unit${i}`);
    expect(digits(7, 3, false, " m")).toBe("0.007 m");
    expect(digits(7, 3, false, "")).toBe("0.007");
  });

  it("many decimals read right, the few-figure ones kept and the rest written afresh, asked twice", () => {
    // a ± far finer than its label's step: "± 0.000005 m" (6 decimals), "± 0.000000012 m" (9)
    const wrong: string[] = [];
    for (const d of [4, 5, 6, 9, 12, 13, 15]) {
      for (const f of [0, 5, 12, 99, 999, 1000, 4321]) {
        for (const whole of [0, 3, 1234]) {
          const n = whole * 10 ** d + f;
          if (!Number.isSafeInteger(n)) continue;
          const want = `${whole.toLocaleString("en-GB")}.${String(f).padStart(d, "0")} m`;
          for (let twice = 0; twice < 2; twice++) if (digits(n, d, false, " m") !== want) wrong.push(`${n} ${d}`);
          if (digits(n, d, false, " m", true) !== `± ${want}`) wrong.push(`± ${n} ${d}`);
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(formatFixed(0.000005, 6)).toBe("0.000005");
  });
});


describe("digits on either side of 2^31", () => {
  /** The same figure from the integer's decimal string (BigInt: no floating point at all). */
  const reference = (n: number, d: number, suffix: string, plusMinus: boolean) => {
    const s = BigInt(n).toString().padStart(d + 1, "0");
    const whole = s.slice(0, s.length - d).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
    return (plusMinus ? "± " : "") + whole + "." + s.slice(s.length - d) + suffix;
  };

  it("reads the same from 32-bit integers (n < 2^31, up to 9 decimals) as from any integer", () => {
    let seed = 31;
    const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const ns = [0, 1, 9, 10, 999, 1000, 2 ** 31 - 1, 2 ** 31, 2 ** 31 + 1, 2 ** 32, 4e15];
    for (let k = 0; k < 3000; k++) ns.push(Math.floor(10 ** (15.5 * rand())));
    for (const n of ns) {
      for (let d = 1; d <= 12; d++) {
        for (const [suffix, plusMinus] of [[" km", false], [" m", true], ["", false]] as const) {
          expect(digits(n, d, false, suffix, plusMinus), `${n} ${d}`).toBe(reference(n, d, suffix, plusMinus));
        }
      }
    }
  });
});
