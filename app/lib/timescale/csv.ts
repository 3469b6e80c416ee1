// Eonscale interval CSV: export and import (format documented in README.md).
//
//   name,rank,parent,base_ma,base_uncertainty_ma,top_ma,color,gssp,approximate,order,names_json,boundary_kind
//
// boundary_kind (GSSP / GSSA / empty) came later: it is written last and is optional on import,
// so files written before it still read (the kind is then "not stated").
//
// RFC 4180 quoting: fields holding a comma, a double quote, a line break or leading/trailing
// spaces are enclosed in double quotes, with inner quotes doubled. Lines end with "\n" on
// export; "\r\n", "\n" and "\r" are all read. A UTF-8 byte-order mark is ignored.

import { type CsvCell, unneutraliseCell, writeSafeCsv } from "../csv-safe";
import { check } from "./check";
import { validateInterval } from "./schema";
import type { Interval, ParseResult, Problem } from "./types";

export const CSV_COLUMNS = [
  "name",
  "rank",
  "parent",
  "base_ma",
  "base_uncertainty_ma",
  "top_ma",
  "color",
  "gssp",
  "approximate",
  "order",
  "names_json",
  "boundary_kind",
] as const;
type Column = (typeof CSV_COLUMNS)[number];
/** Columns a file may leave out (added after the format was first published). */
const OPTIONAL_COLUMNS: readonly Column[] = ["boundary_kind"];

const FIELD_TO_COLUMN: Record<string, Column> = {
  name: "name",
  rank: "rank",
  parent: "parent",
  baseMa: "base_ma",
  baseUncertaintyMa: "base_uncertainty_ma",
  topMa: "top_ma",
  color: "color",
  gssp: "gssp",
  approximate: "approximate",
  order: "order",
  names: "names_json",
  boundaryKind: "boundary_kind",
};

// ------------------------------------------------------------------------------------------
// Generic quoted-CSV reading and writing.
// ------------------------------------------------------------------------------------------

export interface CsvRecord {
  /** 1-based line on which the record starts. */
  line: number;
  fields: string[];
}

export interface CsvReadResult {
  records: CsvRecord[];
  errors: Array<{ line: number; message: string }>;
}

/** Read RFC 4180 CSV. Blank lines are skipped. */
export function readCsv(text: string): CsvReadResult {
  const records: CsvRecord[] = [];
  const errors: CsvReadResult["errors"] = [];
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  const n = text.length;

  while (i < n) {
    const startLine = line;
    const fields: string[] = [];
    let field = "";
    let broken = false;
    // One record.
    for (;;) {
      if (i < n && text[i] === '"') {
        // Quoted field.
        i++;
        let closed = false;
        while (i < n) {
          const ch = text[i];
          if (ch === '"') {
            if (text[i + 1] === '"') {
              field += '"';
              i += 2;
              continue;
            }
            i++;
            closed = true;
            break;
          }
          if (ch === "\r" || ch === "\n") {
            if (ch === "\r" && text[i + 1] === "\n") {
              field += "\r\n";
              i += 2;
            } else {
              field += ch;
              i++;
            }
            line++;
            continue;
          }
          field += ch;
          i++;
        }
        if (!closed) {
          errors.push({ line: startLine, message: "a quoted field is not closed before the end of the file" });
          broken = true;
          i = n;
          break;
        }
        if (i < n && text[i] !== "," && text[i] !== "\r" && text[i] !== "\n") {
          errors.push({ line, message: "unexpected text after a closing quote (a quote inside a field must be doubled)" });
          broken = true;
          // Skip to the end of this physical line.
          while (i < n && text[i] !== "\r" && text[i] !== "\n") i++;
        }
      } else {
        // Unquoted field.
        while (i < n && text[i] !== "," && text[i] !== "\r" && text[i] !== "\n") {
          if (text[i] === '"' && !broken) {
            errors.push({ line, message: "a double quote inside an unquoted field (quote the whole field and double the quote)" });
            broken = true;
          }
          field += text[i];
          i++;
        }
      }
      fields.push(field);
      field = "";
      if (i < n && text[i] === ",") {
        i++;
        continue;
      }
      // End of record.
      if (i < n && text[i] === "\r") i += text[i + 1] === "\n" ? 2 : 1;
      else if (i < n && text[i] === "\n") i++;
      line++;
      break;
    }
    const blank = fields.length === 1 && fields[0] === "";
    if (!broken && !blank) records.push({ line: startLine, fields });
  }
  return { records, errors };
}

/** CSV text of rows (csv-stringify, formula-starting text cells neutralised: app/lib/csv-safe.ts). */
export function writeCsv(rows: ReadonlyArray<ReadonlyArray<CsvCell>>): string {
  return writeSafeCsv(rows);
}

// ------------------------------------------------------------------------------------------
// Intervals ↔ CSV.
// ------------------------------------------------------------------------------------------

function numberText(x: number | null): string {
  return x === null ? "" : String(x); // shortest text that reads back as the same number
}

export function exportCsv(intervals: readonly Interval[]): string {
  const rows: string[][] = [[...CSV_COLUMNS]];
  for (const iv of intervals) {
    rows.push([
      iv.name,
      iv.rank,
      iv.parent ?? "",
      numberText(iv.baseMa),
      numberText(iv.baseUncertaintyMa),
      numberText(iv.topMa),
      iv.color,
      iv.gssp === null ? "" : String(iv.gssp),
      String(iv.approximate),
      String(iv.order),
      Object.keys(iv.names).length ? JSON.stringify(iv.names) : "",
      iv.boundaryKind ?? "",
    ]);
  }
  return writeCsv(rows);
}

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A number, or the original text (so validation reports it), or null when empty and allowed. */
function toNumber(s: string, emptyIsNull: boolean): number | string | null | undefined {
  const t = s.trim();
  if (t === "") return emptyIsNull ? null : undefined;
  return DECIMAL.test(t) ? Number(t) : s;
}

function toBoolean(s: string, emptyIsNull: boolean): boolean | string | null | undefined {
  const t = s.trim().toLowerCase();
  if (t === "") return emptyIsNull ? null : undefined;
  if (t === "true") return true;
  if (t === "false") return false;
  return s;
}

export interface CsvParseResult extends ParseResult {
  /** File line of each returned interval (same index). */
  lines: number[];
}

export interface ImportOptions {
  /** Run check() once every row is valid (default true). */
  check?: boolean;
}

export function parseCsv(text: string, options: ImportOptions = {}): CsvParseResult {
  const { records, errors } = readCsv(text);
  const problems: Problem[] = errors.map((e) => ({ interval: "", field: "", message: e.message, line: e.line, rule: "syntax" }));
  const intervals: Interval[] = [];
  const lines: number[] = [];
  if (records.length === 0) {
    if (!problems.length) problems.push({ interval: "", field: "", message: "the file is empty (a header line is required)", line: 1, rule: "syntax" });
    return { intervals, problems, lines };
  }

  const header = records[0];
  const columns = header.fields.map((f) => f.trim().toLowerCase());
  const index = new Map<string, number>();
  columns.forEach((c, i) => {
    if (index.has(c)) problems.push({ interval: "", field: c, message: `column "${c}" appears twice in the header`, line: header.line, rule: "syntax" });
    else index.set(c, i);
  });
  const missing = CSV_COLUMNS.filter((c) => !index.has(c) && !OPTIONAL_COLUMNS.includes(c));
  const unknown = columns.filter((c) => !(CSV_COLUMNS as readonly string[]).includes(c));
  if (missing.length) problems.push({ interval: "", field: missing.join(","), message: `header lacks column${missing.length > 1 ? "s" : ""}: ${missing.join(", ")}`, line: header.line, rule: "syntax" });
  if (unknown.length) problems.push({ interval: "", field: unknown.join(","), message: `unknown column${unknown.length > 1 ? "s" : ""}: ${unknown.join(", ")}`, line: header.line, rule: "syntax" });
  if (missing.length) return { intervals, problems, lines };

  let rowsValid = problems.length === 0;
  for (const rec of records.slice(1)) {
    // A cell Eonscale neutralised on export ('=…) reads back as written (app/lib/csv-safe.ts).
    const get = (c: Column) => unneutraliseCell(index.has(c) ? (rec.fields[index.get(c)!] ?? "") : "");
    const nameText = get("name");
    if (rec.fields.length !== columns.length) {
      problems.push({
        interval: nameText,
        field: "",
        message: `expected ${columns.length} fields, found ${rec.fields.length}`,
        line: rec.line,
        rule: "row",
      });
      rowsValid = false;
      continue;
    }
    let names: unknown = {};
    const namesText = get("names_json").trim();
    const rowProblems: Problem[] = [];
    if (namesText !== "") {
      try {
        names = JSON.parse(namesText);
      } catch {
        rowProblems.push({ interval: nameText, field: "names_json", message: "names_json is not valid JSON (expected an object such as {\"de\":\"Kreide\"})", line: rec.line, rule: "row" });
      }
    }
    const parentText = get("parent").trim();
    const candidate = {
      name: nameText,
      rank: get("rank").trim().toLowerCase(),
      parent: parentText === "" ? null : parentText,
      baseMa: toNumber(get("base_ma"), false),
      baseUncertaintyMa: toNumber(get("base_uncertainty_ma"), true),
      topMa: toNumber(get("top_ma"), false),
      color: get("color").trim(),
      gssp: toBoolean(get("gssp"), true),
      boundaryKind: get("boundary_kind").trim() === "" ? null : get("boundary_kind").trim().toUpperCase(),
      approximate: toBoolean(get("approximate"), false),
      order: toNumber(get("order"), false),
      names,
    };
    const v = validateInterval(candidate, rec.line, (f) => FIELD_TO_COLUMN[f] ?? f);
    rowProblems.push(...v.problems.filter((p) => !(p.field === "names_json" && rowProblems.some((q) => q.field === "names_json"))));
    if (rowProblems.length || !v.interval) {
      problems.push(...rowProblems);
      rowsValid = false;
      continue;
    }
    intervals.push(v.interval);
    lines.push(rec.line);
  }

  if (rowsValid && options.check !== false) problems.push(...check(intervals, { lines }));
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0)); // stable: file order, then rule order
  return { intervals, problems, lines };
}
