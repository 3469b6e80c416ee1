/**
 * Radioactive decay and the age equation. Pure: no I/O, runs in the browser and on the server.
 *
 * Units: every function takes times and half-lives in one and the same unit (years, Ma, …) and
 * answers in that unit; a decay constant is per that unit. The equations are the standard ones
 * (e.g. Faure, G. & Mensing, T.M. (2005) Isotopes: Principles and Applications, 3rd ed., Wiley,
 * chapters 3–6; Dickin, A.P. (2018) Radiogenic Isotope Geology, 3rd ed., Cambridge University
 * Press, chapter 1):
 *
 *   λ = ln 2 / t½                          decay constant
 *   N/N₀ = e^(−λt)                         fraction of the parent left after time t
 *   D* / N = e^(λt) − 1                      radiogenic daughter per parent atom left (no initial daughter)
 *   t = ln(1 + D* / N) / λ                   the age equation
 *
 * and, for a branched decay where only the fraction λₑ/λ of the decays gives the measured daughter
 * (⁴⁰K → ⁴⁰Ar by electron capture, the rest → ⁴⁰Ca by β⁻):
 *
 *   D* / N = (λₑ/λ)(e^(λt) − 1),  t = ln(1 + (λ/λₑ)·D* / N) / λ.
 *
 * `expm1` and `log1p` keep full precision when λt is small (young ages, long half-lives).
 */

export const LN2 = Math.LN2;

/** A value with its (one-sigma or two-sigma — whatever the input was) absolute uncertainty. */
export interface WithUncertainty {
  value: number;
  uncertainty: number;
}

function assertPositive(name: string, x: number) {
  if (!(Number.isFinite(x) && x > 0)) throw new RangeError(`${name} must be a positive finite number (got ${x}).`);
}

function assertNotNegative(name: string, x: number) {
  if (!(Number.isFinite(x) && x >= 0)) throw new RangeError(`${name} must be zero or a positive finite number (got ${x}).`);
}

/** λ = ln 2 / t½, per unit of the half-life. */
export function decayConstant(halfLife: number): number {
  assertPositive("The half-life", halfLife);
  return LN2 / halfLife;
}

/** t½ = ln 2 / λ. */
export function halfLifeFromDecayConstant(lambda: number): number {
  assertPositive("The decay constant", lambda);
  return LN2 / lambda;
}

/** Mean life τ = 1/λ = t½ / ln 2 (e.g. the 8033 a of the Libby radiocarbon half-life). */
export function meanLife(halfLife: number): number {
  assertPositive("The half-life", halfLife);
  return halfLife / LN2;
}

/** N/N₀ = e^(−λt): the fraction of the parent atoms left after time t. */
export function fractionRemaining(t: number, halfLife: number): number {
  assertNotNegative("The time", t);
  return Math.exp(-decayConstant(halfLife) * t);
}

/** 1 − N/N₀: the fraction of the parent atoms that have decayed after time t. */
export function fractionDecayed(t: number, halfLife: number): number {
  assertNotNegative("The time", t);
  return -Math.expm1(-decayConstant(halfLife) * t);
}

/** t = −ln(N/N₀)/λ: the time it takes to leave the fraction f of the parent (0 < f ≤ 1). */
export function timeForFractionRemaining(f: number, halfLife: number): number {
  if (!(f > 0 && f <= 1)) throw new RangeError(`The fraction left must be above 0 and at most 1 (got ${f}).`);
  return -Math.log(f) / decayConstant(halfLife);
}

/** D* / N = e^(λt) − 1: radiogenic daughter atoms per parent atom left, with no initial daughter. */
export function daughterParentRatio(t: number, halfLife: number): number {
  assertNotNegative("The time", t);
  return Math.expm1(decayConstant(halfLife) * t);
}

/** The age equation t = ln(1 + D* / N)/λ (all the daughter is radiogenic, the system stayed closed). */
export function ageFromRatio(ratio: number, halfLife: number): number {
  assertNotNegative("The daughter/parent ratio", ratio);
  return Math.log1p(ratio) / decayConstant(halfLife);
}

/**
 * The age equation with first-order (linear) propagation of the uncertainties of the half-life and
 * of the measured ratio, combined in quadrature (they are independent). With t = t½·ln(1+R)/ln 2:
 *   ∂t/∂t½ = t/t½,   ∂t/∂R = 1/(λ(1+R)).
 * The answer's uncertainty is at the level (1σ or 2σ) of the inputs.
 */
export function ageFromRatioWithUncertainty(
  ratio: number,
  halfLife: number,
  opts: { halfLifeUncertainty?: number; ratioUncertainty?: number } = {},
): WithUncertainty {
  const sT = opts.halfLifeUncertainty ?? 0;
  const sR = opts.ratioUncertainty ?? 0;
  assertNotNegative("The half-life uncertainty", sT);
  assertNotNegative("The ratio uncertainty", sR);
  const t = ageFromRatio(ratio, halfLife);
  const fromHalfLife = (t / halfLife) * sT;
  const fromRatio = sR / (decayConstant(halfLife) * (1 + ratio));
  return { value: t, uncertainty: Math.hypot(fromHalfLife, fromRatio) };
}

/**
 * N/N₀ with the half-life's uncertainty propagated: ∂f/∂t½ = f·λt/t½ (f = e^(−λt)).
 */
export function fractionRemainingWithUncertainty(t: number, halfLife: number, halfLifeUncertainty = 0): WithUncertainty {
  assertNotNegative("The half-life uncertainty", halfLifeUncertainty);
  const f = fractionRemaining(t, halfLife);
  const lt = decayConstant(halfLife) * t;
  return { value: f, uncertainty: ((f * lt) / halfLife) * halfLifeUncertainty };
}

// ---------------------------------------------------------------------------------------------
// Branched decay (K–Ar)
// ---------------------------------------------------------------------------------------------

/** Decay constants of a branched parent: the total λ and the partial λ of the branch measured. */
export interface BranchedDecay {
  /** Total decay constant λ (all branches), per unit of time. */
  total: number;
  /** Partial decay constant of the branch that gives the measured daughter (λₑ for ⁴⁰K → ⁴⁰Ar). */
  branch: number;
}

function assertBranched(d: BranchedDecay) {
  assertPositive("The total decay constant", d.total);
  assertPositive("The branch decay constant", d.branch);
  if (d.branch > d.total) throw new RangeError(`The branch decay constant (${d.branch}) cannot exceed the total (${d.total}).`);
}

/** D* / N = (λₑ/λ)(e^(λt) − 1): e.g. radiogenic ⁴⁰Ar per ⁴⁰K atom left after time t. */
export function branchedDaughterParentRatio(t: number, decay: BranchedDecay): number {
  assertBranched(decay);
  assertNotNegative("The time", t);
  return (decay.branch / decay.total) * Math.expm1(decay.total * t);
}

/** The K–Ar age equation t = (1/λ) ln(1 + (λ/λₑ)·⁴⁰Ar* / ⁴⁰K). */
export function branchedAgeFromRatio(ratio: number, decay: BranchedDecay): number {
  assertBranched(decay);
  assertNotNegative("The daughter/parent ratio", ratio);
  return Math.log1p((decay.total / decay.branch) * ratio) / decay.total;
}

/** Alias with the trade name: K–Ar age from radiogenic ⁴⁰Ar* / ⁴⁰K. */
export const kArAge = branchedAgeFromRatio;
