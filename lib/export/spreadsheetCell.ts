/**
 * Spreadsheet-safe text cells for every CSV the program writes.
 *
 * A spreadsheet reads a cell that starts with `=`, `+`, `-` or `@` as a formula, and some
 * read a leading tab or carriage return the same way, so an imported stratum name such as
 * `=HYPERLINK(…)` could run as a formula when the exported file is opened ("CSV injection").
 * The usual guard is to put a single quotation mark in front of such a cell, which makes the
 * spreadsheet show it as text (OWASP, "CSV Injection", owasp.org/www-community/attacks/CSV_Injection,
 * from memory).
 *
 * Guard TEXT cells only: a number column's `-0.5` is a number, not a formula, and must stay as
 * written. The guard is reversible, so our own readers read the guarded form back to the
 * original value: a cell that already starts with quotation marks followed by a trigger gets
 * one more quotation mark, and {@link unguardTextCell} takes exactly one off. For every text
 * `s`, `unguardTextCell(guardTextCell(s)) === s`.
 *
 * @example
 * guardTextCell('=SUM(A1)')   //=> "'=SUM(A1)"
 * guardTextCell("'=SUM(A1)")  //=> "''=SUM(A1)"
 * guardTextCell('north')      //=> 'north'
 * unguardTextCell("'=SUM(A1)") //=> '=SUM(A1)'
 */

/** The first characters that make a spreadsheet read a cell as a formula. */
export const FORMULA_TRIGGERS: readonly string[] = ['=', '+', '-', '@', '\t', '\r'];

/** The mark put in front of a cell that would otherwise be read as a formula. */
export const TEXT_MARK = "'";

/** Quotation marks (none or more) then a trigger: the cells the guard changes. */
const NEEDS_MARK = /^'*[=+\-@\t\r]/;
/** One or more quotation marks then a trigger: the cells a guard wrote. */
const HAS_MARK = /^'+[=+\-@\t\r]/;

/** True when a spreadsheet would read `text` as a formula. */
export function startsLikeFormula(text: string): boolean {
  return text.length > 0 && FORMULA_TRIGGERS.includes(text.charAt(0));
}

/** A text cell made safe to open in a spreadsheet: a leading trigger gets a `'` in front; anything else is returned as is. */
export function guardTextCell(text: string): string {
  return NEEDS_MARK.test(text) ? `${TEXT_MARK}${text}` : text;
}

/** The original text of a cell written by {@link guardTextCell} (a cell it left alone comes back as is). */
export function unguardTextCell(cell: string): string {
  return HAS_MARK.test(cell) ? cell.slice(1) : cell;
}
