// The spreadsheet-safe cell rule (OWASP "CSV Injection": = + - @ tab CR) and the one CSV writer.
import { describe, expect, it } from "vitest";
import { neutraliseCell, unneutraliseCell, writeSafeCsv } from "../../app/lib/csv-safe";
import { exportCsv, parseCsv } from "../../app/lib/timescale/csv";
import { safeText } from "../../app/lib/fabrication/schedule";

describe("neutraliseCell", () => {
  it.each([
    ["=HYPERLINK(\"http://evil.example\",\"x\")", "'=HYPERLINK(\"http://evil.example\",\"x\")"],
    ["=cmd|' /C calc'!A0", "'=cmd|' /C calc'!A0"],
    ["+1+2", "'+1+2"],
    ["-2+3+cmd|' /C calc'!A0", "'-2+3+cmd|' /C calc'!A0"],
    ["@SUM(1,1)", "'@SUM(1,1)"],
    ["\t=1", "'\t=1"],
    ["\r=1", "'\r=1"],
    ["+44 20 7946 0000", "'+44 20 7946 0000"],
  ])("text %j → %j", (input, out) => {
    expect(neutraliseCell(input)).toBe(out);
    expect(unneutraliseCell(out)).toBe(input);
  });

  it.each(["-3.1234567", "-12", "0.5", "252.16", "Cambrian", "", "'already quoted", "a=b"])("leaves %j alone", (text) => {
    expect(neutraliseCell(text)).toBe(text);
    expect(unneutraliseCell(text)).toBe(text);
  });

  it("the xlsx/fabrication rule is the same rule", () => {
    expect(safeText("=1+1")).toBe("'=1+1");
    expect(safeText("-0.1276")).toBe("-0.1276");
  });
});

describe("writeSafeCsv", () => {
  it("quotes per RFC 4180, keeps numbers as numbers and neutralises text", () => {
    expect(writeSafeCsv([["a", "b,c", 'say "hi"', " pad", -3.5, null, "=1+2", "line\nbreak"]])).toBe(
      `a,"b,c","say ""hi"""," pad",-3.5,,'=1+2,"line\nbreak"\n`,
    );
  });

  it("intervals.csv: a formula in an interval name is written neutralised and reads back as it was", () => {
    const iv = { name: "=HYPERLINK(\"x\")", rank: "age", parent: null, baseMa: 10, baseUncertaintyMa: null, topMa: 5, color: "#ffffff", gssp: null, approximate: false, order: 1, names: {}, boundaryKind: null };
    const text = exportCsv([iv as never]);
    expect(text.split("\n")[1].startsWith(`"'=HYPERLINK(""x"")"`)).toBe(true);
    const back = parseCsv(text, { check: false });
    expect(back.intervals[0]?.name).toBe(iv.name);
  });
});
