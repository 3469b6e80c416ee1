// Exact decimal ages, their display and the dated-event form schema (pure).
import { describe, expect, it } from "vitest";
import { DatedEventFormSchema, formatAge, formatExactYears, fromMa, normaliseDoi, shiftDecimal, slugify, toMa } from "../../../app/lib/dated-events";
import { SEED_DATED_EVENTS } from "../../../db/data/dated-events/dated-events.ts";

describe("exact decimals", () => {
  it("moves the decimal point without floating-point noise", () => {
    expect(toMa("11700", "a")).toBe("0.0117");
    expect(toMa("315", "ka")).toBe("0.315");
    expect(toMa("4.4", "Ga")).toBe("4400");
    expect(toMa("4567.30", "Ma")).toBe("4567.30");
    expect(toMa("0.1", "ka")).toBe("0.0001");
    expect(fromMa("0.0117", "ka")).toBe("11.7");
    expect(fromMa("0.000099", "ka")).toBe("0.099");
    expect(fromMa("66.043", "Ga")).toBe("0.066043");
    expect(shiftDecimal("007.50", 1)).toBe("75.0");
    expect(() => shiftDecimal("1e3", 0)).toThrow();
  });

  it("shows an age in the unit it reads best in, with its kind", () => {
    expect(formatAge("4567.30", "0.16").text).toBe("4567.30 ± 0.16 Ma");
    expect(formatAge("0.315", "0.034").text).toBe("315 ± 34 ka");
    expect(formatAge("0.0052", null, "approximate").text).toBe("about 5.2 ka");
    expect(formatAge("4510", null, "minimum").text).toBe("at least 4510 Ma");
    expect(formatAge("0.0005", null).text).toBe("500 a");
    expect(formatAge(66.043, 0.011).text).toBe("66.043 ± 0.011 Ma");
  });

  it("shows half-lives in a fitting unit", () => {
    expect(formatExactYears("4468300000", "4800000")).toBe("4.4683 ± 0.0048 Ga");
    expect(formatExactYears("703810000", "960000")).toBe("703.81 ± 0.96 Ma");
    expect(formatExactYears("705000", "24000")).toBe("705 ± 24 ka");
    expect(formatExactYears("5730", "40")).toBe("5730 ± 40 a");
  });

  it("makes slugs and tidies DOIs", () => {
    expect(slugify("Niedźwiedzki's trackways — Zachełmie")).toBe("niedzwiedzki-s-trackways-zachelmie");
    expect(normaliseDoi("https://doi.org/10.1038/35051550")).toBe("10.1038/35051550");
    expect(normaliseDoi("doi: 10.1038/35051550")).toBe("10.1038/35051550");
  });
});

describe("DatedEventFormSchema", () => {
  const good = {
    name: "Basalt of Marrowby Weir",
    summary: "A lava flow exposed by the weir, dated for the museum's river trail.",
    ageValue: "61.2",
    ageUnit: "Ma",
    uncertaintyValue: "0.4",
    ageKind: "point",
    citation: "Example, A. (2020). A made-up paper for a unit test. Journal of Tests 1, 1–2.",
    doi: "",
    url: "",
    datingMethod: "",
    verification: "from memory",
  };

  it("turns a good form into exact Ma strings and a slug", () => {
    const r = DatedEventFormSchema.parse({ ...good, ageValue: "315", ageUnit: "ka", uncertaintyValue: "34" });
    expect(r).toMatchObject({ ageMa: "0.315", uncertaintyMa: "0.034", slug: "basalt-of-marrowby-weir", doi: null, url: null, datingMethod: null });
  });

  it("names the field and the reason for each mistake", () => {
    const cases: [Record<string, string>, string, RegExp][] = [
      [{ name: "" }, "name", /^Name:/],
      [{ summary: "short" }, "summary", /^Summary:.*10 characters/],
      [{ ageValue: "" }, "ageValue", /^Age: enter the age/],
      [{ ageValue: "4,404" }, "ageValue", /^Age: write a plain number/],
      [{ ageValue: "-3" }, "ageValue", /^Age: write a plain number/],
      [{ ageValue: "15", ageUnit: "Ga" }, "ageValue", /older than the Universe/],
      [{ ageUnit: "Myr" }, "ageUnit", /^Age unit:/],
      [{ uncertaintyValue: "abc" }, "uncertaintyValue", /^Uncertainty: write a plain number/],
      [{ uncertaintyValue: "70" }, "uncertaintyValue", /cannot be larger than the age/],
      [{ ageKind: "guess" }, "ageKind", /^Kind of age:/],
      [{ citation: "Someone" }, "citation", /^Citation: give the full reference/],
      [{ citation: "Someone, A. A paper without any year at all. Journal 1, 2." }, "citation", /year of publication/],
      [{ doi: "not a doi" }, "doi", /^DOI:/],
      [{ url: "ftp://example.org/x" }, "url", /^Link:/],
      [{ datingMethod: "x".repeat(201) }, "datingMethod", /^Dating method: use at most 200/],
      [{ verification: "probably" }, "verification", /^Checked:/],
      [{ slug: "Not A Slug" }, "slug", /^Slug:/],
    ];
    for (const [patch, field, message] of cases) {
      const r = DatedEventFormSchema.safeParse({ ...good, ...patch });
      expect(r.success, `${field} ${JSON.stringify(patch)}`).toBe(false);
      const issue = r.error!.issues.find((i) => i.path[0] === field);
      expect(issue?.message, field).toMatch(message);
    }
  });

  it("accepts every seeded entry", () => {
    expect(SEED_DATED_EVENTS.length).toBeGreaterThanOrEqual(25);
    for (const e of SEED_DATED_EVENTS) {
      const r = DatedEventFormSchema.safeParse({ ...e, ageValue: e.ageMa, ageUnit: "Ma", uncertaintyValue: e.uncertaintyMa ?? "", doi: e.doi ?? "", url: e.url ?? "", datingMethod: e.datingMethod ?? "" });
      expect(r.success, e.slug).toBe(true);
    }
  });
});
