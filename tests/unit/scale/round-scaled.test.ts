// roundScaled decides a·10^k rounded half up on the exact product; a quick answer is taken when
// the rounded product is farther from the half than its own rounding error can reach. Checked
// here against exact rational arithmetic (BigInt), on random values and on values built to sit
// within a few ulps of a half, where only the exact product can decide.
import { describe, expect, it } from "vitest";
import { clean, decadeOf, pow10, roundScaled } from "../../../app/lib/units";

/** a·10^k rounded half up, exactly (a ≥ 0 finite), −1 for an exact tie or a product ≥ 4e15. */
function exact(a: number, k: number): number {
  if (!(a * 10 ** k < 4e15)) return -1;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, a);
  const bits = view.getBigUint64(0);
  const biased = Number((bits >> 52n) & 0x7ffn);
  const frac = bits & ((1n << 52n) - 1n);
  const mant = biased === 0 ? frac : frac | (1n << 52n);
  const exp = (biased === 0 ? 1 : biased) - 1075; // a = mant · 2^exp
  const num = mant * 10n ** BigInt(k);
  if (exp >= 0) return Number(num << BigInt(exp));
  const den = 1n << BigInt(-exp);
  const q = num / den;
  const twice = 2n * (num % den);
  return twice > den ? Number(q + 1n) : twice < den ? Number(q) : -1;
}

let seed = 4242;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;

describe("roundScaled", () => {
  it("matches exact rational rounding on 200,000 random values and 200,000 near-halves", () => {
    const wrong: string[] = [];
    for (let i = 0; i < 200_000; i++) {
      const k = Math.floor(rand() * 16);
      const a = 10 ** (rand() * 18 - 12);
      if (roundScaled(a, k) !== exact(a, k)) wrong.push(`${a} ${k}`);
    }
    for (let i = 0; i < 200_000; i++) {
      const k = Math.floor(rand() * 10);
      const whole = Math.floor(rand() * 10 ** (1 + Math.floor(rand() * 9)));
      const half = (whole + 0.5) / 10 ** k; // the double nearest a decimal half …
      let a = half;
      const steps = Math.floor(rand() * 7) - 3; // … and the doubles a few ulps either side
      for (let s = 0; s < Math.abs(steps); s++) a = steps > 0 ? nextUp(a) : nextDown(a);
      if (roundScaled(a, k) !== exact(a, k)) wrong.push(`${a} ${k}`);
    }
    expect(wrong.slice(0, 10)).toEqual([]);
  });

  it("clean still keeps 15 significant figures (as toPrecision(15))", () => {
    const wrong: number[] = [];
    for (let i = 0; i < 100_000; i++) {
      const x = (rand() < 0.5 ? -1 : 1) * 10 ** (rand() * 24 - 9);
      if (clean(x) !== Number(x.toPrecision(15))) wrong.push(x);
    }
    expect(wrong.slice(0, 10)).toEqual([]);
  });

  it("clean finds the decade right at every power of ten and at the ends of its fast range", () => {
    // clean takes the decade from the binary exponent and corrects it by one comparison: the
    // powers of ten and the doubles just beside them are where an off-by-one would show
    const wrong: number[] = [];
    for (let e = -9; e <= 16; e++) {
      for (const p of [10 ** e, Number(`1e${e}`), 2 ** Math.floor(e * Math.log2(10)), 2 ** Math.ceil(e * Math.log2(10))]) {
        let a = p;
        let b = p;
        for (let s = 0; s < 4; s++) {
          for (const x of [a, b, -a, -b, a * (1 + 5e-15), b * (1 - 5e-16)]) if (!Object.is(clean(x), Number(x.toPrecision(15)))) wrong.push(x);
          a = nextUp(a);
          b = nextDown(b);
        }
      }
    }
    // decimal halves at the 15th figure (the exact product decides), and the values clean leaves alone
    for (const x of ["1.000000000000005", "123456789012345.5", "0.1234567890123455", "9.999999999999995", "99999999999999.95"].map(Number)) if (!Object.is(clean(x), Number(x.toPrecision(15)))) wrong.push(x);
    expect(wrong.slice(0, 10)).toEqual([]);
    expect([clean(0), clean(-0), clean(NaN), clean(Infinity), clean(-Infinity)]).toEqual([0, -0, NaN, Infinity, -Infinity]);
    expect(Object.is(clean(-0), -0)).toBe(true);
  });
});

function nextUp(x: number): number {
  const v = new DataView(new ArrayBuffer(8));
  v.setFloat64(0, x);
  v.setBigUint64(0, v.getBigUint64(0) + 1n);
  return v.getFloat64(0);
}
function nextDown(x: number): number {
  const v = new DataView(new ArrayBuffer(8));
  v.setFloat64(0, x);
  v.setBigUint64(0, v.getBigUint64(0) - 1n);
  return v.getFloat64(0);
}

describe("decadeOf", () => {
  it("is the largest k with pow10(k) ≤ y over its whole range, at every power of ten and the doubles beside it", () => {
    const byTable = (y: number) => {
      let k = -30;
      while (k < 29 && pow10(k + 1) <= y) k++;
      return k;
    };
    const wrong: string[] = [];
    for (let e = -30; e <= 29; e++) {
      let a = pow10(e);
      let b = pow10(e);
      for (let s = 0; s < 3; s++) {
        for (const y of [a, b]) if (y >= 1e-30 && y < 1e30 && decadeOf(y) !== byTable(y)) wrong.push(`${y}`);
        a = nextUp(a);
        b = nextDown(b);
      }
    }
    for (let i = 0; i < 100_000; i++) {
      const y = 10 ** (rand() * 59.9 - 30);
      if (decadeOf(y) !== byTable(y)) wrong.push(`${y}`);
    }
    expect(wrong.slice(0, 10)).toEqual([]);
  });
});
