/**
 * Writing CSV that is safe to open in a spreadsheet. Every export (Change report, an athlete's
 * own data) goes through `toCsv`, so no cell can run as a formula.
 *
 * Text is stored exactly as typed (a name may really start with "="); it is neutralised only on
 * the way out. Source: OWASP, "CSV Injection" — cells beginning with =, +, -, @, tab (0x09) or
 * carriage return (0x0D) can be read as formulas; prefix such cells with a single quote and
 * quote the field. Quoting follows RFC 4180 (fields with quotes, separators or line breaks are
 * wrapped in double quotes, inner quotes doubled).
 *
 * Numbers are data, not text: a negative score such as -1.5 in a numeric column is written as
 * the number it is, never prefixed, so spreadsheets still read it as a number. Only strings are
 * escaped; callers must pass numbers as numbers.
 */
export type CsvCell = string | number | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;
// ";" too: spreadsheets in many locales split on it, so a bare one would break the row there.
const NEEDS_QUOTES = /[",;\r\n]/;

export function escapeCsvCell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  // NaN and the infinities are not data a spreadsheet can hold: an empty cell says "no value".
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows to CSV text: comma-separated, CRLF line ends (RFC 4180), a line end after the last row. */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map(escapeCsvCell).join(",")).join("\r\n") + (rows.length ? "\r\n" : "");
}
