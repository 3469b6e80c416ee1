import { describe, expect, it } from "vitest";
import { CSV_COLUMNS, exportCsv, exportJson, parseCsv, parseJson, readCsv, writeCsv, type Interval } from "../../../app/lib/timescale";
import { loadEdition, tinyChart } from "./helpers";

const HEADER = CSV_COLUMNS.join(",");

describe("CSV reader", () => {
  it("reads quoted fields with commas, doubled quotes and line breaks, keeping start lines", () => {
    const text = 'a,b,c\r\n"x, y","say ""hi""","two\nlines"\n\nplain,,end\n';
    expect(readCsv(text)).toEqual({
      records: [
        { line: 1, fields: ["a", "b", "c"] },
        { line: 2, fields: ["x, y", 'say "hi"', "two\nlines"] },
        { line: 5, fields: ["plain", "", "end"] },
      ],
      errors: [],
    });
  });

  it("ignores a byte-order mark and a missing final newline; reads \\r line ends", () => {
    expect(readCsv("\uFEFFa,b\rc,d").records).toEqual([
      { line: 1, fields: ["a", "b"] },
      { line: 2, fields: ["c", "d"] },
    ]);
  });

  it("reports broken quoting with its line", () => {
    expect(readCsv('a,b\n"open,b\n').errors).toEqual([{ line: 2, message: "a quoted field is not closed before the end of the file" }]);
    expect(readCsv('a,b\n"x"y,b\n').errors).toEqual([
      { line: 2, message: "unexpected text after a closing quote (a quote inside a field must be doubled)" },
    ]);
    expect(readCsv('a,b\nx"y,b\n').errors).toEqual([
      { line: 2, message: "a double quote inside an unquoted field (quote the whole field and double the quote)" },
    ]);
  });

  it("writes what it reads", () => {
    const rows = [["name", "note"], ["a, b", 'q"q'], [" lead", "multi\r\nline"], ["", "x"]];
    expect(readCsv(writeCsv(rows)).records.map((r) => r.fields)).toEqual(rows);
  });
});

describe("CSV and JSON import/export round-trip", () => {
  for (const slug of ["ics-2024-12", "ics-2023-09"] as const) {
    const intervals = loadEdition(slug).intervals;

    it(`CSV: ${slug} exports and parses back identically`, () => {
      const csv = exportCsv(intervals);
      const back = parseCsv(csv);
      expect(back.problems).toEqual([]);
      expect(back.intervals).toEqual(intervals);
      expect(exportCsv(back.intervals)).toBe(csv);
      expect(csv.split("\n")[0]).toBe(HEADER);
      expect(back.lines.slice(0, 3)).toEqual([2, 3, 4]);
    });

    it(`JSON: ${slug} exports and parses back identically`, () => {
      const json = exportJson(intervals);
      const back = parseJson(json);
      expect(back.problems).toEqual([]);
      expect(back.intervals).toEqual(intervals);
      expect(exportJson(back.intervals)).toBe(json);
    });
  }

  it("JSON import also reads an edition file ({ edition, intervals })", () => {
    const e = loadEdition("ics-2024-12");
    expect(parseJson(JSON.stringify(e)).intervals).toEqual(e.intervals);
  });

  it("CSV keeps names with commas, quotes and non-Latin scripts", () => {
    const chart = tinyChart().map((iv) =>
      iv.name === "A1" ? { ...iv, names: { ja: "完新統／世", fr: 'l\'"Âge", un' } } : iv,
    );
    const renamed = chart.map((iv) => (iv.name === "P1" ? { ...iv, name: 'P1, "first"' } : iv.parent === "P1" ? { ...iv, parent: 'P1, "first"' } : iv));
    const back = parseCsv(exportCsv(renamed));
    expect(back.problems).toEqual([]);
    expect(back.intervals).toEqual(renamed);
  });
});

describe("import with errors reports line numbers and fields", () => {
  const good = exportCsv(tinyChart()).trimEnd().split("\n");

  it("CSV: boundary_kind is optional (files written before it still read) and must be GSSP, GSSA or empty", () => {
    const header = good[0].split(",");
    const at = header.indexOf("boundary_kind");
    expect(at).toBe(header.length - 1);
    const withoutColumn = good.map((l) => l.replace(/,[^,]*$/, "")).join("\n");
    const old = parseCsv(withoutColumn);
    expect(old.problems).toEqual([]);
    expect(old.intervals.every((iv) => iv.boundaryKind === null)).toBe(true);
    const lines = [...good];
    lines[3] = lines[3].replace(/,false,false,/, ",true,false,").replace(/,$/, ",gssa"); // E1 (line 4): lower case accepted
    lines[4] = lines[4].replace(/,$/, ",GSSX"); // P1 (line 5)
    const r = parseCsv(lines.join("\n"));
    expect(r.problems.filter((p) => p.rule === "row")).toEqual([
      { interval: "P1", field: "boundary_kind", line: 5, rule: "row", message: "boundary kind must be GSSP, GSSA or empty (not stated)" },
    ]);
    const kindWithoutRatification = [...good];
    kindWithoutRatification[4] = kindWithoutRatification[4].replace(/,$/, ",GSSP"); // P1 is gssp false
    expect(parseCsv(kindWithoutRatification.join("\n")).problems.map((p) => `${p.interval} ${p.field} ${p.rule}`)).toContain("P1 boundaryKind boundary-kind");
  });

  it("CSV: bad values on their file lines, with the CSV column names", () => {
    const lines = [...good];
    lines[2] = lines[2].replace(",eon,", ",aeon,"); // Young (line 3)
    lines[4] = lines[4].replace(",20,", ",twenty,"); // P1 (line 5): base_ma
    lines[6] = lines[6].replace("#ABCDEF", "blue"); // E2 (line 7)
    lines[8] = lines[8].replace(",false,false,", ",yes,false,"); // Ep1 (line 9): gssp
    lines[11] = lines[11].replace(/,,$/, ',"{""de"":",'); // A2 (line 12): names_json, quoted but not JSON (boundary_kind, last, stays empty)
    const r = parseCsv(lines.join("\n") + "\n");
    expect(r.problems).toEqual([
      { interval: "Young", field: "rank", line: 3, rule: "row", message: "rank must be one of eon, era, period, subperiod, epoch, age" },
      { interval: "P1", field: "base_ma", line: 5, rule: "row", message: "base age must be a number of Ma" },
      { interval: "E2", field: "color", line: 7, rule: "row", message: 'colour must be a hex colour "#RRGGBB"' },
      { interval: "Ep1", field: "gssp", line: 9, rule: "row", message: "gssp must be true, false or empty (not stated)" },
      { interval: "A2", field: "names_json", line: 12, rule: "row", message: 'names_json is not valid JSON (expected an object such as {"de":"Kreide"})' },
    ]);
  });

  it("CSV: wrong field count, missing columns, broken quotes", () => {
    const lines = [...good];
    lines[3] = lines[3] + ",extra";
    expect(parseCsv(lines.join("\n")).problems).toEqual([
      { interval: "E1", field: "", line: 4, rule: "row", message: "expected 12 fields, found 13" },
    ]);
    expect(parseCsv("name,rank\nX,eon\n").problems[0]).toEqual({
      interval: "",
      field: "parent,base_ma,base_uncertainty_ma,top_ma,color,gssp,approximate,order,names_json",
      line: 1,
      rule: "syntax",
      message: "header lacks columns: parent, base_ma, base_uncertainty_ma, top_ma, color, gssp, approximate, order, names_json",
    });
    const broken = [...good];
    broken[5] = broken[5].replace("P2", '"P2');
    expect(parseCsv(broken.join("\n")).problems[0]).toMatchObject({ line: 6, rule: "syntax" });
    expect(parseCsv("").problems).toEqual([{ interval: "", field: "", line: 1, rule: "syntax", message: "the file is empty (a header line is required)" }]);
  });

  it("CSV: valid rows but a broken chart → check() problems on file lines", () => {
    const lines = [...good];
    lines[5] = lines[5].replace("P2,period,E1,15,", "P2,period,E1,14,"); // line 6
    expect(parseCsv(lines.join("\n")).problems).toEqual([
      { interval: "P2", field: "baseMa", line: 6, rule: "sibling-gap", message: 'gap of 1 Ma under "E1" between "P1" (top 15 Ma) and "P2" (base 14 Ma)' },
    ]);
  });

  it("JSON: problems carry the array index and the field", () => {
    const chart: unknown[] = tinyChart();
    chart[1] = { ...(chart[1] as Interval), baseMa: "20" };
    chart[4] = { ...(chart[4] as Interval), order: 1.5, extra: true };
    const r = parseJson(JSON.stringify(chart));
    expect(r.problems).toEqual([
      { interval: "Young", field: "baseMa", line: 1, rule: "row", message: "base age must be a number of Ma" },
      { interval: "P2", field: "order", line: 4, rule: "row", message: "order must be a whole number" },
      { interval: "P2", field: "extra", line: 4, rule: "row", message: "unknown field: extra" },
    ]);
  });

  it("JSON: syntax and shape errors", () => {
    expect(parseJson("{").problems[0]).toMatchObject({ rule: "syntax" });
    expect(parseJson('{"a":1}').problems[0].message).toBe('expected an array of intervals, or an object with an "intervals" array');
  });
});
