/**
 * Formula-injection neutralising for every text cell we export.
 *
 * A spreadsheet program treats text that starts with `=`, `+`, `-` or `@`
 * as a formula, and a leading tab or carriage return can smuggle one past a
 * CSV import. We prefix such text with an apostrophe, the usual marker for
 * "this is text" (OWASP, "CSV Injection"; common practice, no other source).
 * On import the apostrophe is removed again, so names round-trip unchanged.
 */

/** Characters that make a spreadsheet program read a cell as a formula. */
export const FORMULA_TRIGGERS = ["=", "+", "-", "@", "\t", "\r"] as const;

/**
 * Prefixes text that could be read as a formula with an apostrophe.
 *
 * @example
 * ```ts
 * neutraliseText("=HYPERLINK(\"x\")"); // "'=HYPERLINK(\"x\")"
 * neutraliseText("TEOS"); // "TEOS"
 * ```
 */
export function neutraliseText(text: string): string {
  return text.length > 0 && (FORMULA_TRIGGERS as readonly string[]).includes(text[0]!) ? `'${text}` : text;
}

/**
 * Undoes `neutraliseText` on imported text: an apostrophe followed by a
 * formula trigger is dropped; anything else is kept as it is.
 *
 * @example
 * ```ts
 * restoreText("'=1+2"); // "=1+2"
 * restoreText("'quoted"); // "'quoted"
 * ```
 */
export function restoreText(text: string): string {
  return text.length > 1 && text[0] === "'" && (FORMULA_TRIGGERS as readonly string[]).includes(text[1]!) ? text.slice(1) : text;
}
