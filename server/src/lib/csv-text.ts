/**
 * A spreadsheet opening a CSV runs a cell that begins with = + - @, a tab or a carriage return
 * (or the full-width = + - @ some normalise to those) as a formula (OWASP, "CSV Injection").
 * Apostrophes already in front of such a character count too, so the guard can be undone exactly.
 */
const FORMULA_START = /^'*[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;
const GUARDED = /^'+[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;

/**
 * A free-text CSV cell (a name, a citation, a note) that a spreadsheet shows and never runs: text
 * that would start a formula gets a leading apostrophe, the usual guard. Every CSV writer passes
 * its text columns here and never its numeric ones, whose leading '-' is a sign (which is why
 * csv-stringify's all-columns `escape_formulas` is not used). JSON and XML keep the text as is.
 */
export function guardCsvText(text: string): string;
export function guardCsvText(text: string | null): string | null;
export function guardCsvText(text: string | null): string | null {
  return text !== null && FORMULA_START.test(text) ? `'${text}` : text;
}

/** The text a guarded cell was made from: for readers that compare the CSV with the JSON. */
export function unguardCsvText(cell: string): string {
  return GUARDED.test(cell) ? cell.slice(1) : cell;
}
