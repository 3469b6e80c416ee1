// Each correction to the shared library and the decay systems, checked against the value its
// source gives (the source is written beside each expectation). These would have failed on the
// figures shipped before the corrections.
import { describe, expect, it } from "vitest";
import { SEED_DATED_EVENTS } from "../../../db/data/dated-events/dated-events.ts";
import { SEED_DECAY_SYSTEMS } from "../../../db/data/dated-events/decay-systems.ts";
import { formatExactYears, VERIFICATIONS } from "../../../app/lib/dated-events";

const event = (slug: string) => {
  const e = SEED_DATED_EVENTS.find((x) => x.slug === slug);
  if (!e) throw new Error(`no library entry ${slug}`);
  return e;
};
const system = (slug: string) => {
  const s = SEED_DECAY_SYSTEMS.find((x) => x.slug === slug);
  if (!s) throw new Error(`no decay system ${slug}`);
  return s;
};

describe("dated-event corrections", () => {
  it("LD 350-1: bracketing tuffs ~2.82 and ~2.67 Ma; 2.80–2.75 Ma is the sedimentation-rate model; age stays 2.775 ± 0.025", () => {
    // Villmoare et al. 2015 abstract (Science 347: 1352): "Homo at 2.80 to 2.75 Ma".
    const e = event("earliest-homo-ledi-geraru");
    expect([e.ageMa, e.uncertaintyMa]).toEqual(["2.775", "0.025"]);
    expect(e.summary).toMatch(/2\.82 Ma \(Gurumaha Tuff/);
    expect(e.summary).toMatch(/2\.67 Ma \(Lee Adoyta Tuff/);
    expect(e.summary).toMatch(/sedimentation-rate model/);
    expect(e.summary).not.toMatch(/between volcanic ashes dated 2\.80 and 2\.75/);
  });

  it("Zachełmie: ~390 Ma, which is Eifelian (early Middle Devonian) as the text says", () => {
    // Niedźwiedzki et al. 2010 abstract (Nature 463: 43): Eifelian stage; Qvarnström et al. 2018
    // abstract (Scientific Reports 8): "approximately 390 million years old". ICS 2024/12 Eifelian
    // 393.47–387.95 Ma (db/data/ics/ics-2024-12.json).
    const e = event("zachelmie-tetrapod-trackways");
    expect(e.ageMa).toBe("390");
    expect(Number(e.ageMa)).toBeLessThan(393.47);
    expect(Number(e.ageMa)).toBeGreaterThan(387.95);
  });

  it("Adelobasileus: 225 Ma is Norian on both editions, so the text no longer says Carnian", () => {
    // ICS 2024/12 Norian base ~227.3 Ma; ICS 2023/09 ~227 Ma (db/data/ics).
    const e = event("earliest-mammaliaforms");
    expect(e.ageMa).toBe("225");
    expect(`${e.name} ${e.summary} ${e.datingMethod}`).not.toMatch(/Carnian/);
    expect(e.summary).toMatch(/Norian/);
  });

  it("Ischigualasto: the ash gives a maximum age; the formation's age model is cited", () => {
    // Desojo et al. 2020 abstract (Scientific Reports 10): fossil-bearing interval 229.20 to 226.85 Ma.
    const e = event("earliest-dinosaurs-ischigualasto");
    expect(e.summary).toMatch(/maximum age/);
    expect(e.summary).toMatch(/Desojo et al\. 2020/);
    expect(e.datingMethod).toMatch(/maximum age/);
  });

  it("Rooihoogte: 2316 ± 7 Ma cited to Hannah et al. 2004, the sulfur signal to Luo et al. 2016", () => {
    // Luo et al. 2016 abstract (Science Advances 2: e1600134): "2.33 billion years ago".
    const e = event("rise-of-atmospheric-oxygen-rooihoogte");
    expect([e.ageMa, e.uncertaintyMa]).toEqual(["2316", "7"]);
    expect(e.citation).toMatch(/^Age: Hannah, J\.L\..*\(2004\).*Earth and Planetary Science Letters 225, 43–52/);
    expect(e.citation).toMatch(/Luo, G\..*\(2016\).*Science Advances/);
    expect(e.doi).toBe("10.1126/sciadv.1600134");
  });

  it("Jebel Irhoud: 315 ± 34 ka cited to Richter et al. 2017", () => {
    // Richter et al. 2017 abstract (Nature 546: 293–296): "315 ± 34 thousand years ago".
    const e = event("earliest-homo-sapiens-jebel-irhoud");
    expect([e.ageMa, e.uncertaintyMa]).toEqual(["0.315", "0.034"]);
    expect(e.citation).toMatch(/^Age: Richter, D\./);
    expect(e.doi).toBe("10.1038/nature22335");
  });

  it("'oldest dated mineral grain' and 'oldest dated rock' say 'on Earth' (CAIs and meteorites are older)", () => {
    expect(event("jack-hills-zircon").name).toMatch(/on Earth/);
    expect(event("acasta-gneiss").name).toMatch(/on Earth/);
    expect(Number(event("oldest-solar-system-solids").ageMa)).toBeGreaterThan(Number(event("jack-hills-zircon").ageMa));
  });

  it("Chicxulub shows the ± with systematic uncertainty, as the end-Cretaceous entry says", () => {
    // Renne et al. 2013 as quoted: 66.043 ± 0.043 Ma including systematic uncertainty.
    expect(event("chicxulub-impact").uncertaintyMa).toBe("0.043");
    expect(event("end-cretaceous-extinction").summary).toMatch(/± 0\.043 Ma with it/);
  });

  it("Last Glacial Maximum: the compilation is of ¹⁴C, ¹⁰Be and ³He ages — no luminescence", () => {
    // Clark et al. 2009 abstract (Science 325: 710–714): "We used 5704 14C, 10Be, and 3He ages";
    // nearly all ice sheets at their LGM positions from 26.5 ka to 19–20 ka.
    const e = event("last-glacial-maximum");
    expect(e.ageMa).toBe("0.0265");
    expect(e.datingMethod).not.toMatch(/luminescence/);
    expect(e.datingMethod).toMatch(/5704 radiocarbon and cosmogenic-exposure \(¹⁰Be, ³He\)/);
  });

  it("First land plants: the paper's c. 473–471 Ma is said to be on the 2010 time scale; 470 Ma is Dapingian today", () => {
    // Rubinstein et al. 2010 abstract (New Phytologist 188: 365–369): "Dapingian (early Middle
    // Ordovician, c. 473-471 Ma)". ICS 2024/12 Dapingian 471.3–469.4 Ma, ICS 2023/09 470.0–467.3 Ma
    // (db/data/ics).
    const e = event("first-land-plants-spores");
    expect(e.ageMa).toBe("470");
    expect(e.summary).toMatch(/about 473–471 Ma on the time scale of 2010/);
    expect(Number(e.ageMa)).toBeLessThanOrEqual(471.3);
    expect(Number(e.ageMa)).toBeGreaterThanOrEqual(469.4);
  });

  it("every entry records its verification state, and a source wherever it is not 'from memory'", () => {
    for (const e of SEED_DATED_EVENTS) {
      expect(VERIFICATIONS).toContain(e.verification);
      if (e.verification !== "from memory") expect(e.checkedAgainst, e.slug).toBeTruthy();
    }
    const count = (v: string) => SEED_DATED_EVENTS.filter((e) => e.verification === v).length;
    // 22 checked against the source, 10 seen quoted, 3 from memory (README in db/data/dated-events).
    expect(count("checked against the source")).toBeGreaterThanOrEqual(22);
    expect(count("seen quoted by a secondary source")).toBeGreaterThanOrEqual(10);
    expect(count("from memory")).toBeLessThanOrEqual(3);
  });

  it("entries still 'from memory' say what could and could not be checked", () => {
    for (const e of SEED_DATED_EVENTS.filter((x) => x.verification === "from memory")) {
      expect(e.checkedAgainst, e.slug).toMatch(/from memory/);
    }
  });
});

describe("decay-system corrections", () => {
  it("Sm-147: the IUPAC–IUGS 2020 half-life 106.25 ± 0.38 Ga; Lugmair & Marti kept as the convention", () => {
    // Villa et al. 2020, Geochimica et Cosmochimica Acta 285, 70–77 (value from the issue; paper not reached).
    const s = system("sm147-nd143");
    expect([s.halfLifeYears, s.halfLifeUncertaintyYears]).toEqual(["106250000000", "380000000"]);
    expect(formatExactYears(s.halfLifeYears, s.halfLifeUncertaintyYears)).toBe("106.25 ± 0.38 Ga");
    expect(s.citation).toMatch(/Villa, I\.M\..*\(2020\)/);
    expect(s.notes).toMatch(/Conventional value.*6\.54 × 10⁻¹² a⁻¹ \(Lugmair & Marti 1978\)/);
    expect(s.notes).not.toMatch(/105\.99/);
  });

  it("C-14: the evaluated 5700 ± 30 a is the half-life; 5730 (Cambridge) and 5568 (Libby) are conventions", () => {
    // Evaluated nuclear data (ENSDF via NNDC) 5700 ± 30 a; TUNL compilation: Godwin 1962 5730 ± 40, Libby 5568 ± 30.
    const s = system("c14-n14");
    expect(formatExactYears(s.halfLifeYears, s.halfLifeUncertaintyYears)).toBe("5700 ± 30 a");
    expect(s.notes).toMatch(/“Cambridge” half-life 5730 ± 40 a/);
    expect(s.notes).toMatch(/Libby half-life 5568 ± 30 a/);
  });

  it("K-40: the 10.5 % / 89.5 % branching is labelled the 1977 convention, evaluated values beside it", () => {
    // LNHB/CEA Table de Radionucléides 40K: EC 10.55 (11) % + 0.2 (1) %, β⁻ 89.25 (17) %.
    const s = system("k40-ar40");
    expect(s.decayMode).toMatch(/1977 convention: 10\.5 % \/ 89\.5 %/);
    expect(s.notes).toMatch(/89\.25 ± 0\.17 %/);
  });

  it("U-235: measured ²³⁸U/²³⁵U = 137.818 (Hiess et al. 2012) beside the conventional 137.88", () => {
    // Hiess et al. 2012 abstract (Science 335: 1610): 137.818 ± 0.045 (2σ).
    expect(system("u235-pb207").notes).toMatch(/137\.88 is the 1977 convention.*137\.818 ± 0\.045 \(2σ\)/);
  });

  it("U-238 and U-235: the 2σ ± shown is twice the 1σ of Jaffey et al. 1971", () => {
    // IsoplotR constants, citing Jaffey et al. 1971 (standard errors): λ238 = 1.55125 ± 0.00083 ×
    // 10⁻¹⁰ a⁻¹, λ235 = 9.8485 ± 0.0067 × 10⁻¹⁰ a⁻¹; relative 1σ = 0.0535 % and 0.068 %.
    const u238 = system("u238-pb206");
    const u235 = system("u235-pb207");
    expect(Number(u238.halfLifeUncertaintyYears) / Number(u238.halfLifeYears) / 2).toBeCloseTo(0.00083 / 1.55125, 5);
    expect(Number(u235.halfLifeUncertaintyYears) / Number(u235.halfLifeYears) / 2).toBeCloseTo(0.0067 / 9.8485, 5);
  });

  it("Rb-87: the ± of the 2015 recommendation is 0.0045 × 10⁻¹¹ a⁻¹ on λ, the same share as 0.16 Ga on t½", () => {
    // georefdatar decay constants (uncertainty as stated by the source): Villa et al. 2015,
    // λ = 1.3972 ± 0.0045 × 10⁻¹¹ a⁻¹; Steiger & Jäger 1977, 1.42 × 10⁻¹¹ a⁻¹ without uncertainty.
    const s = system("rb87-sr87");
    expect(s.decayConstantPerYear).toBe("1.3972e-11");
    expect(Number(s.halfLifeUncertaintyYears) / Number(s.halfLifeYears)).toBeCloseTo(0.0045 / 1.3972, 4);
    expect(s.notes).toMatch(/λ = 1\.3972 ± 0\.0045 × 10⁻¹¹ a⁻¹/);
    expect(s.notes).toMatch(/1977 convention λ = 1\.42 × 10⁻¹¹ a⁻¹/);
  });

  it("every decay system records its state; a source wherever it is not 'from memory'", () => {
    for (const s of SEED_DECAY_SYSTEMS) {
      expect(VERIFICATIONS).toContain(s.verification);
      if (s.verification !== "from memory") expect(s.checkedAgainst, s.slug).toBeTruthy();
    }
    // 6 of 10 seen quoted (U-238, U-235, Rb-87, K-40, Lu-176, C-14); Th-232, Sm-147, Re-187, Al-26 from memory.
    expect(SEED_DECAY_SYSTEMS.filter((s) => s.verification !== "from memory").length).toBeGreaterThanOrEqual(6);
  });

  it("every ± says whether it is 1σ or 2σ, or that the level was not checked", () => {
    for (const s of SEED_DECAY_SYSTEMS) {
      if (s.halfLifeUncertaintyYears === null) continue;
      expect(`${s.notes} ${s.citation}`, s.slug).toMatch(/1σ|2σ|not checked/);
    }
  });
});
