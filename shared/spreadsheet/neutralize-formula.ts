// The characters that make a spreadsheet program read a typed or imported cell as a formula.
const FORMULA_TRIGGERS = new Set(['=', '+', '-', '@', '\t', '\r']);

/** The prefix that keeps a cell text: a single quote, which spreadsheet programs show as plain text. */
export const FORMULA_GUARD = "'";

/**
 * Neutralises a text cell that a spreadsheet would run as a formula: text starting with `=`, `+`, `-`,
 * `@`, a tab or a carriage return gets a single quote in front, so it is shown as the text it is.
 * Numbers are written as numbers and never pass through here.
 *
 * Reference: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): prepend a single
 * quote to cells beginning with those characters.
 *
 * @param text the cell's text
 * @returns the text, guarded when it would be read as a formula
 * @example neutralizeFormula('=HYPERLINK("http://example.invalid","x")') // "'=HYPERLINK(\"http://example.invalid\",\"x\")"
 * @example neutralizeFormula('C112A') // 'C112A'
 */
export function neutralizeFormula(text: string): string {
  return text.length > 0 && FORMULA_TRIGGERS.has(text[0]) ? `${FORMULA_GUARD}${text}` : text;
}

/**
 * Undoes {@link neutralizeFormula} on a cell read back in, so that an exported text re-imports unchanged:
 * a single quote is dropped only when the character after it is one that triggers a formula.
 *
 * @param text the cell's text as read
 * @returns the text without the guard
 * @example restoreNeutralizedFormula("'=SUM(A1)") // '=SUM(A1)'
 * @example restoreNeutralizedFormula("'s-trans") // "'s-trans"
 */
export function restoreNeutralizedFormula(text: string): string {
  return text.length > 1 && text[0] === FORMULA_GUARD && FORMULA_TRIGGERS.has(text[1]) ? text.slice(1) : text;
}
