/**
 * "How we know" figures for a marker: given an age and a decay system, how much of the parent is
 * left, how many half-lives have passed and how much radiogenic daughter has grown. Pure.
 */
import {
  branchedDaughterParentRatio,
  daughterParentRatio,
  decayConstant,
  fractionRemainingWithUncertainty,
  LN2,
  type WithUncertainty,
} from "./equations";
import { formatYears } from "../scale/format";

/** What the helper needs of a decay system (the DecaySystem row's fields, as numbers). */
export interface DecaySystemFigures {
  parent: string;
  daughter: string;
  halfLifeYears: number;
  halfLifeUncertaintyYears?: number | null;
  /**
   * Total decay constant per year when the source states one (conventions such as Steiger & Jäger
   * 1977 fix λ rather than t½). When absent, λ = ln 2 / t½.
   */
  decayConstantPerYear?: number | null;
  /** Partial decay constant of the branch that gives this daughter (branched decay), per year. */
  branchConstantPerYear?: number | null;
}

export interface HowWeKnow {
  parent: string;
  daughter: string;
  ageYears: number;
  /** Half-lives elapsed, t/t½ (with t½ = ln 2/λ for the λ used). */
  halfLives: number;
  /** N/N₀ with the half-life's uncertainty propagated (0 when the system states none). */
  fractionRemaining: WithUncertainty;
  /** Radiogenic daughter atoms (of this daughter) per parent atom left, no initial daughter. */
  daughterPerParent: number;
  /** "50.5 %", "0.37 %", "3.1 × 10⁻⁹ %", "practically none". */
  percentText: string;
  /** A sentence for a visitor page. */
  sentence: string;
}

const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

function superscript(n: number): string {
  return String(n).split("").map((c) => SUPERSCRIPT[c] ?? c).join("");
}

/** 1.55125e-10 → "1.55125 × 10⁻¹⁰" (shortest digits that read back as the same number). */
export function formatScientific(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const [mantissa, exponent] = x.toExponential().split("e");
  const exp = Number(exponent);
  return exp === 0 ? mantissa : `${mantissa} × 10${superscript(exp)}`;
}

/** A share as a percentage with three significant figures; tiny shares in powers of ten. */
export function formatPercent(fraction: number): string {
  if (!Number.isFinite(fraction) || fraction < 0) return "—";
  if (fraction === 0) return "practically none";
  const pct = fraction * 100;
  if (pct >= 99.95 && fraction < 1) return "more than 99.9 %";
  if (pct >= 0.01) return `${Number(pct.toPrecision(3)).toString()} %`;
  const [mantissa, exponent] = pct.toExponential(1).split("e");
  return `${mantissa} × 10${superscript(Number(exponent))} %`;
}


/**
 * The fraction of the parent left after `ageYears`, and what that means. Uses the stated total λ
 * when there is one, else ln 2 / t½; the half-life's ± (if given) is propagated to the fraction.
 */
export function howWeKnow(ageYears: number, system: DecaySystemFigures): HowWeKnow {
  if (!(Number.isFinite(ageYears) && ageYears >= 0)) throw new RangeError(`The age must be zero or a positive number of years (got ${ageYears}).`);
  const lambda = system.decayConstantPerYear ?? decayConstant(system.halfLifeYears);
  const halfLife = LN2 / lambda;
  const fraction = fractionRemainingWithUncertainty(ageYears, halfLife, system.halfLifeUncertaintyYears ?? 0);
  const daughterPerParent = system.branchConstantPerYear
    ? branchedDaughterParentRatio(ageYears, { total: lambda, branch: system.branchConstantPerYear })
    : daughterParentRatio(ageYears, halfLife);
  const halfLives = ageYears / halfLife;
  const percentText = formatPercent(fraction.value);
  const left = fraction.value === 0 ? "practically none" : `about ${percentText}`;
  const sentence =
    `After ${formatYears(ageYears, 4)} — ${Number(halfLives.toPrecision(3))} half-lives of ${system.parent} — ` +
    `${left} of the ${system.parent} that was there at the start is left; the rest has become ${system.daughter}` +
    `${system.branchConstantPerYear ? " and other daughters" : ""}.`;
  return { parent: system.parent, daughter: system.daughter, ageYears, halfLives, fractionRemaining: fraction, daughterPerParent, percentText, sentence };
}

/**
 * The decay systems (by seeded slug) behind a dating method as written in the library
 * ("U–Pb zircon (SHRIMP)", "40Ar/39Ar sanidine", "Re–Os pyrite"). Methods that are not radiometric
 * (biostratigraphy, layer counting, luminescence) give none.
 */
export function decaySystemsForMethod(method: string | null | undefined): string[] {
  if (!method) return [];
  const m = method.replace(/[‐‑‒–—−]/g, "-");
  const found: string[] = [];
  const add = (...slugs: string[]) => slugs.forEach((s) => found.includes(s) || found.push(s));
  if (/\bU-Pb\b|\bPb-Pb\b|\bU-corrected Pb/i.test(m)) add("u238-pb206", "u235-pb207");
  if (/\b40Ar\/39Ar\b|\bAr-Ar\b|\bK-Ar\b|\bAr\/Ar\b/i.test(m)) add("k40-ar40");
  if (/\bRe-Os\b/i.test(m)) add("re187-os187");
  if (/\bRb-Sr\b/i.test(m)) add("rb87-sr87");
  if (/\bSm-Nd\b/i.test(m)) add("sm147-nd143");
  if (/\bLu-Hf\b/i.test(m)) add("lu176-hf176");
  if (/\bAl-Mg\b/i.test(m)) add("al26-mg26");
  if (/radiocarbon|\b14C\b|\bC-14\b/i.test(m)) add("c14-n14");
  return found;
}
