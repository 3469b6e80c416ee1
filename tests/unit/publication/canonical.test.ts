// Canonical JSON against RFC 8785 (JSON Canonicalization Scheme), https://www.rfc-editor.org/rfc/rfc8785.
// Each expected value is the RFC's own: §3.2.2 (the sample document), §3.2.3 (property sorting by
// UTF-16 code units) and Appendix B (number serialisation samples, given there as IEEE 754 bit
// patterns). Values written here from the RFC as remembered and checked against the same tables
// published by several independent implementations' test suites.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { canonicalJson, publicationBody } from "../../../app/lib/publication/canonical.ts";

/** The double whose IEEE 754 bits are `hex` (Appendix B gives its samples this way). */
function ieee754(hex: string): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

describe("canonicalJson against RFC 8785", () => {
  it("§3.2.2: the sample document (whitespace removed, properties sorted, numbers and strings in their canonical form)", () => {
    // RFC 8785 §3.2.2, the input as the RFC prints it (parsed as JSON text).
    const input = String.raw`{
  "numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],
  "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/",
  "literals": [null, true, false]
}`;
    // RFC 8785 §3.2.2, the canonical output.
    const expected = String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\u000f\nA'B\"\\\\\"/"}`;
    expect(canonicalJson(JSON.parse(input))).toBe(expected);
  });

  it("§3.2.3: properties sorted by UTF-16 code units (the emoji's surrogate pair sorts before U+FB33)", () => {
    // RFC 8785 §3.2.3, the sorting sample.
    const input = String.raw`{
  "\u20ac": "Euro Sign",
  "\r": "Carriage Return",
  "\ufb33": "Hebrew Letter Dalet With Dagesh",
  "1": "One",
  "\ud83d\ude00": "Emoji: Grinning Face",
  "\u0080": "Control",
  "\u00f6": "Latin Small Letter O With Diaeresis"
}`;
    const out = canonicalJson(JSON.parse(input));
    // RFC 8785 §3.2.3: the expected order of the values.
    expect([...out.matchAll(/":"([^"]+)"/g)].map((m) => m[1])).toEqual([
      "Carriage Return",
      "One",
      "Control",
      "Latin Small Letter O With Diaeresis",
      "Euro Sign",
      "Emoji: Grinning Face",
      "Hebrew Letter Dalet With Dagesh",
    ]);
    expect(out.startsWith(String.raw`{"\r":"Carriage Return","1":"One",`)).toBe(true);
  });

  // RFC 8785 Appendix B, "Number Serialization Samples": IEEE 754 bits → JSON text.
  const APPENDIX_B: [bits: string, json: string, note: string][] = [
    ["0000000000000000", "0", "zero"],
    ["8000000000000000", "0", "minus zero"],
    ["0000000000000001", "5e-324", "min pos number"],
    ["8000000000000001", "-5e-324", "min neg number"],
    ["7fefffffffffffff", "1.7976931348623157e+308", "max pos number"],
    ["ffefffffffffffff", "-1.7976931348623157e+308", "max neg number"],
    ["4340000000000000", "9007199254740992", "max pos int"],
    ["c340000000000000", "-9007199254740992", "max neg int"],
    ["4430000000000000", "295147905179352830000", "~2**68"],
    ["44b52d02c7e14af5", "9.999999999999997e+22", ""],
    ["44b52d02c7e14af6", "1e+23", ""],
    ["44b52d02c7e14af7", "1.0000000000000001e+23", ""],
    ["444b1ae4d6e2ef4e", "999999999999999700000", ""],
    ["444b1ae4d6e2ef4f", "999999999999999900000", ""],
    ["444b1ae4d6e2ef50", "1e+21", ""],
    ["3eb0c6f7a0b5ed8c", "9.999999999999997e-7", ""],
    ["3eb0c6f7a0b5ed8d", "0.000001", ""],
    ["41b3de4355555553", "333333333.3333332", ""],
    ["41b3de4355555554", "333333333.33333325", ""],
    ["41b3de4355555555", "333333333.3333333", ""],
    ["41b3de4355555556", "333333333.3333334", ""],
    ["41b3de4355555557", "333333333.33333343", ""],
    ["becbf647612f3696", "-0.0000033333333333333333", ""],
    ["43143ff3c1cb0959", "1424953923781206.2", "round to even"],
  ];
  for (const [bits, json, note] of APPENDIX_B) {
    it(`Appendix B: ${bits} → ${json}${note ? ` (${note})` : ""}`, () => {
      expect(canonicalJson(ieee754(bits))).toBe(json);
      expect(canonicalJson([ieee754(bits)])).toBe(`[${json}]`);
    });
  }

  // Appendix B: NaN (7fffffffffffffff) and Infinity (7ff0000000000000) have no JSON form and must be refused.
  it("Appendix B: NaN and Infinity are refused, naming where they are", () => {
    expect(() => canonicalJson(ieee754("7fffffffffffffff"))).toThrow("canonicalJson: $ is NaN, which JSON cannot hold");
    expect(() => canonicalJson({ markers: [{ distance: ieee754("7ff0000000000000") }] })).toThrow("canonicalJson: $.markers[0].distance is Infinity, which JSON cannot hold");
    expect(() => canonicalJson(undefined)).toThrow(/no JSON form/);
  });
});

describe("the public body of a publication", () => {
  it("is the canonical JSON of { publication, snapshot }, built from the stored canonical snapshot text", () => {
    const meta = { number: 2, hash: "ab".repeat(32), publishedAt: "2026-12-01T10:00:00.000Z", approvedBy: "Rhona Basalt", edition: { slug: "ics-2024-12", label: "ICS 2024/12" } };
    const snapshot = { schemaVersion: 1, markers: [{ signNumber: 1, label: "Base of the Jurassic", ageMa: 201.4 }], exhibit: { title: "Rope" } };
    const stored = canonicalJson(snapshot);
    const body = publicationBody(meta, stored);
    expect(body).toBe(canonicalJson({ publication: meta, snapshot }));
    expect(JSON.parse(body)).toEqual({ publication: meta, snapshot });
    // The ETag's hash is over the stored canonical snapshot; the same value gives the same bytes whatever its key order.
    const reordered = { exhibit: { title: "Rope" }, markers: [{ ageMa: 201.4, label: "Base of the Jurassic", signNumber: 1 }], schemaVersion: 1 };
    expect(createHash("sha256").update(canonicalJson(reordered)).digest("hex")).toBe(createHash("sha256").update(stored).digest("hex"));
  });
});
