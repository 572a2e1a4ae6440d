/*
 * CSV as RFC 4180 describes it (CRLF rows, fields with a comma, quote or line break quoted,
 * quotes doubled), with spreadsheet formula injection defused: a text cell that starts with
 * = + - @ (or a tab or carriage return, which some spreadsheets skip before a formula) gets a
 * leading apostrophe, so it opens as text (OWASP "CSV Injection").
 */

export type CsvValue = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return "";
  // Numbers we write ourselves cannot carry a formula; only text is guarded.
  let text = typeof value === "string" ? value : String(value);
  if (typeof value === "string" && FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(rows: CsvValue[][]): string {
  return rows.map((r) => r.map(csvCell).join(",")).join("\r\n") + "\r\n";
}
