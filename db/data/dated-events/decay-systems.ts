// Decay systems for the "how we know" panels: parent → daughter, half-life ± and decay constant,
// each with its published source. Seeded by db/seeders/reference/2026.12.01T02.00.01.decay-systems.ts.
//
// Half-lives and decay constants are exact decimal strings (Postgres NUMERIC). Where the source (or
// the IUGS convention) fixes the decay constant, `decayConstantStated` is true and the half-life
// shown is ln 2 / λ (worked out with `bc -l`, rounded to the digits of λ); otherwise λ = ln 2 / t½.
import type { Verification } from "../../../app/lib/dated-events.ts";

export interface SeedDecaySystem {
  slug: string;
  parent: string;
  daughter: string;
  decayMode: string;
  halfLifeYears: string;
  halfLifeUncertaintyYears: string | null;
  decayConstantPerYear: string;
  decayConstantStated: boolean;
  /** Partial decay constant of the branch that gives this daughter (branched decay only). */
  branchConstantPerYear: string | null;
  citation: string;
  doi: string | null;
  verification: Verification;
  /** What the figures were checked against and what it confirmed; null = nothing reached ("from memory"). */
  checkedAgainst: string | null;
  notes: string;
  position: number;
}

const STEIGER_JAEGER_1977 =
  "Steiger, R.H. & Jäger, E. (1977). Subcommission on geochronology: convention on the use of decay constants in geo- and cosmochronology. Earth and Planetary Science Letters 36(3), 359–362.";

export const SEED_DECAY_SYSTEMS: readonly SeedDecaySystem[] = [
  {
    slug: "u238-pb206",
    parent: "U-238",
    daughter: "Pb-206",
    decayMode: "α and β⁻ chain (8 α, 6 β⁻)",
    halfLifeYears: "4468300000",
    halfLifeUncertaintyYears: "4800000",
    decayConstantPerYear: "1.55125e-10",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: "Jaffey, A.H., Flynn, K.F., Glendenin, L.E., Bentley, W.C. & Essling, A.M. (1971). Precision measurement of half-lives and specific activities of 235U and 238U. Physical Review C 4(5), 1889–1906.",
    doi: "10.1103/PhysRevC.4.1889",
    verification: "seen quoted by a secondary source",
    checkedAgainst: "IsoplotR constants file and manual (Vermeesch, a peer-reviewed geochronology toolbox; its decay constants come with their standard errors and cite Jaffey et al. 1971, Physical Review C 4: 1889): λ²³⁸ = 1.55125 ± 0.00083 × 10⁻¹⁰ a⁻¹ — seen quoted; that is t½ = 4.4683 ± 0.0024 Ga at 1σ, so ± 4.8 Ma at 2σ as shown. R package documentation (detzrcr) cites the same λ to Steiger & Jäger 1977. The paper itself was not reached.",
    notes: `± is 2σ (the paper's 1σ is ± 0.0024 Ga). The decay constant λ = 1.55125 × 10⁻¹⁰ a⁻¹ is the one adopted by the IUGS convention (${STEIGER_JAEGER_1977}) and used for U–Pb ages. The chain passes through short-lived intermediates (radium, radon), which reach equilibrium within about a million years.`,
    position: 1,
  },
  {
    slug: "u235-pb207",
    parent: "U-235",
    daughter: "Pb-207",
    decayMode: "α and β⁻ chain (7 α, 4 β⁻)",
    halfLifeYears: "703810000",
    halfLifeUncertaintyYears: "960000",
    decayConstantPerYear: "9.8485e-10",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: "Jaffey, A.H., Flynn, K.F., Glendenin, L.E., Bentley, W.C. & Essling, A.M. (1971). Precision measurement of half-lives and specific activities of 235U and 238U. Physical Review C 4(5), 1889–1906.",
    doi: "10.1103/PhysRevC.4.1889",
    verification: "seen quoted by a secondary source",
    checkedAgainst: "Hiess et al. 2012 abstract (Science 335: 1610–1614): “A value of 137.88 has previously been considered invariant”; mean ²³⁸U/²³⁵U 137.818 ± 0.045 (2σ) in zircon — checked. IsoplotR constants (citing Jaffey et al. 1971, with standard errors): λ²³⁵ = 9.8485 ± 0.0067 × 10⁻¹⁰ a⁻¹, i.e. t½ = 703.81 ± 0.48 Ma at 1σ (± 0.96 Ma at 2σ, as shown) — seen quoted; the same file gives 137.818 ± 0.0225 (half the 2σ).",
    notes: `± is 2σ (the paper's 1σ is ± 0.48 Ma). λ = 9.8485 × 10⁻¹⁰ a⁻¹ as adopted by ${STEIGER_JAEGER_1977} Present-day ²³⁸U/²³⁵U: 137.88 is the 1977 convention (used without uncertainty); the measured mean for terrestrial zircon is 137.818 ± 0.045 (2σ) (Hiess, J., Condon, D.J., McLean, N. & Noble, S.R. (2012). ²³⁸U/²³⁵U systematics in terrestrial uranium-bearing minerals. Science 335, 1610–1614, doi:10.1126/science.1215507), which most U–Pb laboratories now use.`,
    position: 2,
  },
  {
    slug: "th232-pb208",
    parent: "Th-232",
    daughter: "Pb-208",
    decayMode: "α and β⁻ chain (6 α, 4 β⁻)",
    halfLifeYears: "14010000000",
    halfLifeUncertaintyYears: null,
    decayConstantPerYear: "4.9475e-11",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: `Le Roux, L.J. & Glendenin, L.E. (1963). Half-life of thorium-232. Proceedings of the National Conference on Nuclear Energy, Pretoria, 83–94. Adopted by: ${STEIGER_JAEGER_1977}`,
    doi: null,
    verification: "from memory",
    checkedAgainst: "IsoplotR constants (citing Le Roux & Glendenin 1963): λ²³² = 4.95 ± 0.25 × 10⁻¹¹ a⁻¹ (standard error) — consistent with 4.9475 × 10⁻¹¹ to three figures, but the convention's own four-figure value (Steiger & Jäger 1977) was not seen (from memory).",
    notes: "The convention states λ = 4.9475 × 10⁻¹¹ a⁻¹ without an uncertainty; the half-life shown is ln 2 / λ.",
    position: 3,
  },
  {
    slug: "rb87-sr87",
    parent: "Rb-87",
    daughter: "Sr-87",
    decayMode: "β⁻",
    halfLifeYears: "49610000000",
    halfLifeUncertaintyYears: "160000000",
    decayConstantPerYear: "1.3972e-11",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: "Villa, I.M., De Bièvre, P., Holden, N.E. & Renne, P.R. (2015). IUPAC-IUGS recommendation on the half life of 87Rb. Geochimica et Cosmochimica Acta 164, 382–385.",
    doi: "10.1016/j.gca.2015.05.025",
    verification: "seen quoted by a secondary source",
    checkedAgainst: "georefdatar, an R data package of geoscience reference values that gives each uncertainty as its source states it: ⁸⁷Rb λ = 1.3972 ± 0.0045 × 10⁻¹¹ a⁻¹ (Villa et al. 2015) and the 1977 convention 1.42 × 10⁻¹¹ a⁻¹ with no uncertainty (Steiger & Jäger) — seen quoted; the ± is 0.32 % of λ, the same share as 0.16 of 49.61 Ga. Older values for comparison: IUPAC/CIAAW rubidium page (2003) 48.8(5) Ga; Davis et al. 1977 (Geochimica et Cosmochimica Acta 41: 1745) 1.419 ± 0.012 × 10⁻¹¹ a⁻¹ (2σ). Villa et al. 2015 itself not reached, so the σ level of its ± is unconfirmed.",
    notes: `The current IUPAC–IUGS recommendation: t½ = 49.61 ± 0.16 Ga, λ = 1.3972 ± 0.0045 × 10⁻¹¹ a⁻¹ (whether the ± is 1σ or 2σ was not checked: the paper was not reached). Much of the older literature uses the 1977 convention λ = 1.42 × 10⁻¹¹ a⁻¹ (t½ ≈ 48.8 Ga; ${STEIGER_JAEGER_1977}), which states no uncertainty; Rb–Sr ages computed with it are about 1.6 % younger.`,
    position: 4,
  },
  {
    slug: "k40-ar40",
    parent: "K-40",
    daughter: "Ar-40",
    decayMode: "Branched: electron capture (and a little β⁺) to ⁴⁰Ar; β⁻ to ⁴⁰Ca. 1977 convention: 10.5 % / 89.5 %; evaluated decay data: about 10.7 % / 89.3 %",
    halfLifeYears: "1250490000",
    halfLifeUncertaintyYears: null,
    decayConstantPerYear: "5.543e-10",
    decayConstantStated: true,
    branchConstantPerYear: "5.81e-11",
    citation: STEIGER_JAEGER_1977,
    doi: "10.1016/0012-821X(77)90060-7",
    verification: "seen quoted by a secondary source",
    checkedAgainst: "LNHB/CEA Table de Radionucléides, ⁴⁰K (Mougeot & Helmer, 2012): EC 10.55 (11) % + 0.2 (1) %, β⁻ 89.25 (17) %, β⁺ 0.00100 (12) %, t½ 1.2504 (30) × 10⁹ a — checked. NNDC NuDat ⁴⁰K decay data sets (ENSDF, Chen, Nuclear Data Sheets 140, 2017): t½ 1.248 (3) × 10⁹ a — checked. georefdatar (R reference-data package, uncertainties as stated by the source): the 1977 convention's total λ = 5.543 × 10⁻¹⁰ a⁻¹ with no uncertainty (Steiger & Jäger), and Renne et al. 2011's 5.5305 ± 0.0135 × 10⁻¹⁰ a⁻¹ — seen quoted. The partial constant λₑ = 0.581 × 10⁻¹⁰ a⁻¹ is from memory.",
    notes: "Total λ = 5.543 × 10⁻¹⁰ a⁻¹ = λₑ (to ⁴⁰Ar, 0.581 × 10⁻¹⁰) + λβ (to ⁴⁰Ca, 4.962 × 10⁻¹⁰); ⁴⁰K/K = 0.01167 atom %. These are the 1977 convention (Steiger & Jäger), which gives the branching 10.5 % (to ⁴⁰Ar) / 89.5 % (to ⁴⁰Ca) and states no uncertainty. Evaluated decay data give electron capture 10.55 ± 0.11 % to the 1460 keV level plus 0.2 ± 0.1 % to the ground state of ⁴⁰Ar, β⁻ 89.25 ± 0.17 % and β⁺ 0.001 % (LNHB/CEA Table de Radionucléides, ⁴⁰K, Mougeot & Helmer 2012; ± are 1σ, as usual in evaluated nuclear data); compilations derived from ENSDF quote 10.72 % / 89.28 %. Only the λₑ branch makes argon, so the K–Ar age is t = (1/λ) ln(1 + (λ/λₑ)·⁴⁰Ar*/⁴⁰K). Newer calibrations (Min et al. 2000, Geochimica et Cosmochimica Acta 64: 73–98; Renne et al. 2011, Geochimica et Cosmochimica Acta 75: 5097–5100) differ slightly; state which constants an age uses.",
    position: 5,
  },
  {
    slug: "sm147-nd143",
    parent: "Sm-147",
    daughter: "Nd-143",
    decayMode: "α",
    halfLifeYears: "106250000000",
    halfLifeUncertaintyYears: "380000000",
    decayConstantPerYear: "6.5237e-12",
    decayConstantStated: false,
    branchConstantPerYear: null,
    citation: "Villa, I.M., Holden, N.E., Possolo, A., Ickert, R.B., Hibbert, D.B. & Renne, P.R. (2020). IUPAC-IUGS recommendation on the half-lives of 147Sm and 146Sm. Geochimica et Cosmochimica Acta 285, 70–77. Conventional value: Lugmair, G.W. & Marti, K. (1978). Lunar initial 143Nd/144Nd: differential evolution of the lunar crust and mantle. Earth and Planetary Science Letters 39(3), 349–357 (doi:10.1016/0012-821X(78)90021-3).",
    doi: null,
    verification: "from memory",
    checkedAgainst: "Not reached: Villa et al. 2020 (106.25 ± 0.38 Ga) could not be read here in three searches; the IUPAC project page (Recommendations for isotope data in the geosciences II) says the task group was preparing its ¹⁴⁶Sm/¹⁴⁷Sm recommendation in 2020. A review by Tavares & Terranova (Notas de Física, CBPF) gives 106.3 ± 0.5 Ga, consistent. IsoplotR constants (citing Lugmair & Marti 1978): λ = 6.54 ± 0.049 × 10⁻¹² a⁻¹ (standard error) — the conventional value seen quoted. Correction: the half-life was shown as 105.99 Ga, five digits from the three-digit conventional λ = 6.54 × 10⁻¹² a⁻¹.",
    notes: "The current IUPAC–IUGS recommended half-life is 106.25 ± 0.38 Ga (Villa et al. 2020; the uncertainty level was not checked here); λ = ln 2 / t½ = 6.5237 × 10⁻¹² a⁻¹. Conventional value, still used by most Sm–Nd ages: λ = 6.54 × 10⁻¹² a⁻¹ (Lugmair & Marti 1978), i.e. t½ ≈ 106 Ga — three significant figures, as the constant has. The two differ by about 0.25 %.",
    position: 6,
  },
  {
    slug: "lu176-hf176",
    parent: "Lu-176",
    daughter: "Hf-176",
    decayMode: "β⁻",
    halfLifeYears: "37126000000",
    halfLifeUncertaintyYears: "159000000",
    decayConstantPerYear: "1.867e-11",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: "Söderlund, U., Patchett, P.J., Vervoort, J.D. & Isachsen, C.E. (2004). The 176Lu decay constant determined by Lu–Hf and U–Pb isotope systematics of Precambrian mafic intrusions. Earth and Planetary Science Letters 219(3–4), 311–324.",
    doi: null,
    verification: "seen quoted by a secondary source",
    checkedAgainst: "R package documentation (detzrcr) citing Söderlund, Patchett, Vervoort & Isachsen 2004 (EPSL 219: 311–324): λ¹⁷⁶Lu = 1.867 × 10⁻¹¹ a⁻¹; IsoplotR constants: 1.867 ± 0.008 × 10⁻¹¹ a⁻¹, which it treats as a standard error — seen quoted. Independent calibrations agree: Scherer et al. 2001 abstract (Science 293: 683) 1.865 ± 0.015 and Amelin 2005 abstract (Science 310: 839) 1.864 ± 0.016 × 10⁻¹¹ a⁻¹ — checked. The paper's own σ level was not confirmed.",
    notes: "λ = 1.867 ± 0.008 × 10⁻¹¹ a⁻¹; the half-life and its ± are ln 2 / λ propagated. Whether the paper's ± is 1σ or 2σ was not checked (IsoplotR treats it as a standard error; from memory the paper says 2σ).",
    position: 7,
  },
  {
    slug: "re187-os187",
    parent: "Re-187",
    daughter: "Os-187",
    decayMode: "β⁻",
    halfLifeYears: "41605000000",
    halfLifeUncertaintyYears: "425000000",
    decayConstantPerYear: "1.666e-11",
    decayConstantStated: true,
    branchConstantPerYear: null,
    citation: "Smoliar, M.I., Walker, R.J. & Morgan, J.W. (1996). Re-Os ages of group IIA, IIIA, IVA, and IVB iron meteorites. Science 271(5252), 1099–1102.",
    doi: "10.1126/science.271.5252.1099",
    verification: "from memory",
    checkedAgainst: "Smoliar, Walker & Morgan 1996 abstract (Science 271(5252): 1099–1102): Re–Os isochrons of IIA, IIIA, IVA and IVB irons, with an absolute age of 4558 Ma assumed for the IIIA irons (the anchor of the decay-constant calibration) — checked. The λ = 1.666 ± 0.017 × 10⁻¹¹ a⁻¹ itself is not in the abstract (from memory); IsoplotR uses a later calibration, 1.6689 ± 0.0038 × 10⁻¹¹ a⁻¹.",
    notes: "λ = 1.666 ± 0.017 × 10⁻¹¹ a⁻¹ (calibrated against U–Pb-dated meteorites); whether the ± is 1σ or 2σ was not checked. Used for Re–Os pyrite and molybdenite ages, e.g. the 2316 Ma Rooihoogte pyrite.",
    position: 8,
  },
  {
    slug: "al26-mg26",
    parent: "Al-26",
    daughter: "Mg-26",
    decayMode: "β⁺ and electron capture",
    halfLifeYears: "705000",
    halfLifeUncertaintyYears: "24000",
    decayConstantPerYear: "9.832e-7",
    decayConstantStated: false,
    branchConstantPerYear: null,
    citation: "Norris, T.L., Gancarz, A.J., Rokop, D.J. & Thomas, K.W. (1983). Half-life of 26Al. Journal of Geophysical Research 88 (Supplement), B331–B333.",
    doi: null,
    verification: "from memory",
    checkedAgainst: "Encyclopaedia pages on aluminium-26 and the isotopes of aluminium: t½ = 7.17 × 10⁵ years (β⁺ 84 %, electron capture 16 %) — seen quoted for the evaluated value in the notes. Norris et al. 1983 (705 ± 24 ka, the figure shown) not reached (from memory).",
    notes: "± as published (1σ or 2σ not checked). Short-lived and long extinct in the Solar System: ²⁶Al–²⁶Mg dates the first few million years after the CAIs relative to them, not in years before present. Evaluated data give 0.717 Ma (7.17 × 10⁵ a, as quoted by encyclopaedia pages); state which half-life a relative age uses.",
    position: 9,
  },
  {
    slug: "c14-n14",
    parent: "C-14",
    daughter: "N-14",
    decayMode: "β⁻",
    halfLifeYears: "5700",
    halfLifeUncertaintyYears: "30",
    decayConstantPerYear: "1.2160e-4",
    decayConstantStated: false,
    branchConstantPerYear: null,
    citation: "Evaluated nuclear data: ¹⁴C half-life 5700 ± 30 a (ENSDF, as published by the US National Nuclear Data Center in NuDat). Conventions: Godwin, H. (1962). Half-life of radiocarbon. Nature 195(4845), 984 (the Cambridge half-life, 5730 ± 40 a, doi:10.1038/195984a0); Libby half-life 5568 ± 30 a (Anderson & Libby 1951).",
    doi: null,
    verification: "seen quoted by a secondary source",
    checkedAgainst: "Duke/TUNL ¹⁴C evaluation page (data compilation): Cambridge 5730 ± 40 a (Godwin 1962), Libby 5568 ± 30 a, recommended 5686 ± 40 a (2015) — checked. An encyclopaedia data box quoting 5700 ± 30 a from evaluated data — seen quoted. Correction: the Cambridge convention was shown as the half-life.",
    notes: "The half-life shown is the evaluated value, 5700 ± 30 a (± 1σ). The Duke/TUNL evaluation of light nuclei recommends 5686 ± 40 a (2015). Two conventions remain in use: the “Cambridge” half-life 5730 ± 40 a (Godwin 1962), and the Libby half-life 5568 ± 30 a, with which conventional radiocarbon ages are still computed (mean life 8033 a: Stuiver, M. & Polach, H.A. (1977). Discussion: reporting of 14C data. Radiocarbon 19(3), 355–363) and then calibrated to calendar years with a curve such as IntCal20 (Reimer et al. 2020, Radiocarbon 62: 725–757). Radiocarbon reaches back only about 50,000 years.",
    position: 10,
  },
];
