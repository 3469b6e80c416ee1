// Spreadsheet-safe cells: the one rule against formula ("CSV") injection, for every CSV and xlsx
// file Eonscale writes. Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection):
// a cell beginning with = + - @ tab (0x09) or carriage return (0x0D) may be run as a formula, so
// such a cell is written with a leading single quote ('), which spreadsheets read as "text".
//
// Decision for numbers: a cell that is exactly a plain decimal number ("-3.1234567", "12", "-0.5")
// is a number, not text, and is written unchanged — it cannot carry a formula, and a negative
// longitude must stay a number in the spreadsheet. Everything else that begins with a trigger
// character (labels, sources, interval names, "-1+2", "+44 20 …") is text and gets the quote.
// The package's browser build (it carries its own Buffer): this module also runs in the browser
// (chart pages import the interval CSV code), where the Node build's top-level Buffer.from fails.
import { stringify } from "csv-stringify/browser/esm/sync";

const TRIGGERS = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^-?\d+(\.\d+)?$/;

/** The text of a cell as a spreadsheet should show it: formula-starting text gets a leading '. */
export function neutraliseCell(text: string): string {
  return TRIGGERS.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}

/** The inverse, for files Eonscale reads back (its own exports): '=x → =x; anything else unchanged. */
export function unneutraliseCell(text: string): string {
  return text.startsWith("'") && TRIGGERS.test(text.slice(1)) && !PLAIN_NUMBER.test(text.slice(1)) ? text.slice(1) : text;
}

export type CsvCell = string | number | null | undefined;

/**
 * RFC 4180 CSV (csv-stringify): fields holding a comma, a double quote, a line break or
 * leading/trailing spaces are quoted, inner quotes doubled, lines end with "\n". Text cells are
 * neutralised (above); JS numbers are written as numbers; null/undefined as empty.
 */
export function writeSafeCsv(rows: ReadonlyArray<ReadonlyArray<CsvCell>>): string {
  if (rows.length === 0) return "";
  return stringify(
    rows.map((r) => r.map((c) => (c == null ? "" : typeof c === "number" ? String(c) : neutraliseCell(c)))),
    { record_delimiter: "\n", quoted_match: /^\s|\s$/, eof: true },
  );
}
