/*
 * Text a spreadsheet would run as a formula is written with a leading apostrophe; reading it back
 * takes exactly that apostrophe off again, so an unchanged export imports back to the same data.
 * A value that itself starts with an apostrophe before one of those characters (or before another
 * apostrophe) gets one too, else it could not be told apart from an escaped cell. Pure: no Next, no
 * database, so the importers and unit tests share it.
 */

// Some spreadsheets, typed into with an East Asian input method, take the full-width ＝ ＋ － ＠ for
// their ASCII forms and start a formula.
const FORMULA_START = "=+\\-@\\t\\r\\uFF1D\\uFF0B\\uFF0D\\uFF20";
const STARTS_FORMULA = new RegExp(`^[${FORMULA_START}]`);
const ESCAPED = new RegExp(`^'[${FORMULA_START}']`);

export function escapeFormula(text: string): string {
  return STARTS_FORMULA.test(text) || ESCAPED.test(text) ? `'${text}` : text;
}

/** The reverse of escapeFormula; an apostrophe before ordinary text is the person's own and stays. */
export function unescapeFormula(text: string): string {
  return ESCAPED.test(text) ? text.slice(1) : text;
}
