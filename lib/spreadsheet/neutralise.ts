/**
 * Formula-injection neutralising for every text cell we export.
 *
 * The rule is OWASP's "CSV Injection" page
 * (https://owasp.org/www-community/attacks/CSV_Injection): a spreadsheet
 * program treats text that starts with `=`, `+`, `-` or `@` as a formula, and
 * a leading tab (0x09) or carriage return (0x0D) can smuggle one past a CSV
 * import, so such text gets a leading single quote, the usual marker for
 * "this is text". In CSV every cell is also wrapped in double quotes with its
 * double quotes doubled (write.ts). Beyond OWASP's list we also treat a
 * leading line feed (0x0A), the full-width and small forms of the four
 * operators (＝ ＋ － ＠, ﹦ ﹢ ﹣ ﹫, read as the ASCII ones by spreadsheet
 * programs in East Asian locales) and spaces before any trigger as triggers
 * (common practice, no other source). Numbers are never prefixed: they are
 * numeric cells, not text. On import the apostrophe is removed again, so
 * names round-trip unchanged.
 */

/** Characters that make a spreadsheet program read a cell as a formula. */
export const FORMULA_TRIGGERS = [
  "=",
  "+",
  "-",
  "@",
  "\t",
  "\r",
  "\n",
  "\uff1d", // ＝ full-width equals sign
  "\uff0b", // ＋ full-width plus sign
  "\uff0d", // － full-width hyphen-minus
  "\uff20", // ＠ full-width commercial at
  "\ufe66", // ﹦ small equals sign
  "\ufe62", // ﹢ small plus sign
  "\ufe63", // ﹣ small hyphen-minus
  "\ufe6b", // ﹫ small commercial at
] as const;

/** Spaces a trigger may hide behind: space, no-break space, ideographic space. */
const LEADING_SPACE = "[ \\u00a0\\u3000]*";
const TRIGGER_CLASS = `[${FORMULA_TRIGGERS.map((c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}`).join("")}]`;
const STARTS_WITH_TRIGGER = new RegExp(`^${LEADING_SPACE}${TRIGGER_CLASS}`);
const NEUTRALISED = new RegExp(`^'${LEADING_SPACE}${TRIGGER_CLASS}`);

/**
 * Prefixes text that could be read as a formula with an apostrophe.
 *
 * @example
 * ```ts
 * neutraliseText("=HYPERLINK(\"x\")"); // "'=HYPERLINK(\"x\")"
 * neutraliseText("＝1+2"); // "'＝1+2"
 * neutraliseText("TEOS"); // "TEOS"
 * ```
 */
export function neutraliseText(text: string): string {
  return STARTS_WITH_TRIGGER.test(text) ? `'${text}` : text;
}

/**
 * Undoes `neutraliseText` on imported text: an apostrophe followed by a
 * formula trigger (after optional spaces) is dropped; anything else is kept as it is.
 *
 * @example
 * ```ts
 * restoreText("'=1+2"); // "=1+2"
 * restoreText("'quoted"); // "'quoted"
 * ```
 */
export function restoreText(text: string): string {
  return NEUTRALISED.test(text) ? text.slice(1) : text;
}
