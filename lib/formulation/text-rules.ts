import { z } from "zod";
import { required } from "./zod-helpers";

/**
 * Rules for text that people type and others read: names of materials,
 * formulations, process steps and teams, and batch notes. Pure TypeScript, so
 * the engine's schemas and the API's schemas (lib/validations/text.ts) share
 * one definition.
 */

/** A UTF-16 high surrogate not followed by a low one, or a low one without its high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * Bidirectional controls that reorder the text around them: the Arabic letter
 * mark, left-to-right and right-to-left marks, embeddings and overrides
 * (U+202A–U+202E) and isolates (U+2066–U+2069). Source: Unicode Standard
 * Annex #9, table 4; CVE-2021-42574 ("Trojan Source") for the attack.
 */
const BIDI_CONTROL = /[\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/;

/** C0 controls (NUL … U+001F), DEL and the C1 controls (U+0080–U+009F). */
const CONTROL = /[\u0000-\u001F\u007F-\u009F]/;

/** The same, but tab, line feed and carriage return are allowed (multi-line text). */
const CONTROL_EXCEPT_LINE_BREAKS = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

/**
 * Characters that show nothing on their own: white space and separators
 * (\s, Unicode Z*), format characters (Cf: zero-width space U+200B, joiners,
 * word joiner U+2060, byte-order mark U+FEFF, soft hyphen U+00AD, tags …), the
 * combining grapheme joiner, Hangul fillers, Khmer inherent vowels, Mongolian
 * free variation selectors, the braille blank and variation selectors.
 */
const INVISIBLE =
  /[\s\p{Z}\p{Cf}\u034F\u115F\u1160\u17B4\u17B5\u180B-\u180F\u2800\u3164\uFE00-\uFE0F\uFFA0\u{E0100}-\u{E01EF}]/gu;

/** U+0021 "!" … U+007E "~": printable ASCII other than the space; none of them is invisible. */
const FIRST_VISIBLE_ASCII = 0x21;
const LAST_VISIBLE_ASCII = 0x7e;
/** The C0 and C1 controls and DEL lie below U+00A0, the first code unit past them. */
const PAST_CONTROLS = 0xa0;
const FIRST_SURROGATE = 0xd800;
const LAST_SURROGATE = 0xdfff;

/**
 * True when none of the rules below can apply, by one pass over the UTF-16
 * code units: no control character (C0, DEL, C1), no surrogate (so none is
 * lone), no bidirectional control, and at least one printable ASCII
 * character other than the space (so the text has something visible).
 */
function plainlyFine(value: string): boolean {
  let visible = false;
  for (let i = 0; i < value.length; i += 1) {
    const unit = value.charCodeAt(i);
    if (unit >= FIRST_VISIBLE_ASCII && unit <= LAST_VISIBLE_ASCII) {
      visible = true;
    } else if (unit < PAST_CONTROLS) {
      if (unit !== 0x20) return false;
    } else if (
      (unit >= FIRST_SURROGATE && unit <= LAST_SURROGATE) ||
      unit === 0x061c ||
      unit === 0x200e ||
      unit === 0x200f ||
      (unit >= 0x202a && unit <= 0x202e) ||
      (unit >= 0x2066 && unit <= 0x2069)
    ) {
      return false;
    }
  }
  return visible;
}

function codePoint(ch: string): string {
  return `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}`;
}

/**
 * What is wrong with a piece of user-entered text, or null when it is fine:
 * a broken UTF-16 sequence, a bidirectional control, a control character
 * (line breaks and tabs are allowed when `multiline`), or nothing visible at
 * all. The message completes a sentence that starts with the field's label.
 *
 * @example
 * ```ts
 * textProblem("Ethanol"); // null
 * textProblem("\u200B"); // "must contain visible characters"
 * textProblem("abc\u202Eexe"); // "must not contain the bidirectional control U+202E"
 * ```
 */
export function textProblem(value: string, opts: { multiline?: boolean } = {}): string | null {
  // Text with a printable ASCII character other than the space, and without a control character, a surrogate or
  // a bidirectional control anywhere, has none of the problems below; anything else takes the full checks.
  if (plainlyFine(value)) return null;
  if (LONE_SURROGATE.test(value)) return "must not contain a broken character (a lone UTF-16 surrogate)";
  const bidi = BIDI_CONTROL.exec(value);
  if (bidi) return `must not contain the bidirectional control ${codePoint(bidi[0])}`;
  const control = (opts.multiline ? CONTROL_EXCEPT_LINE_BREAKS : CONTROL).exec(value);
  if (control) return `must not contain the control character ${codePoint(control[0])}`;
  if (value.length > 0 && value.replace(INVISIBLE, "").length === 0) return "must contain visible characters";
  return null;
}

/**
 * A name people type: required, at most `max` characters, visible and free of
 * bidirectional and control characters (see `textProblem`). Leading and
 * trailing white space is kept as typed unless `trim` is set.
 *
 * @example
 * ```ts
 * nameText("material name", { max: 200 }).parse("Ethanol"); // "Ethanol"
 * ```
 */
export function nameText(label: string, opts: { max: number; trim?: boolean }): z.ZodType<string, string> {
  const base = z.string({ error: required(label, "text") });
  return (opts.trim ? base.trim() : base)
    .min(1, { error: `${label} must not be empty` })
    .max(opts.max, { error: `${label} must be at most ${opts.max} characters` })
    // a plain check (cheaper for zod than a refinement that adds its own issues); the message names the problem found
    .refine((value) => textProblem(value) === null, { error: (issue) => `${label} ${textProblem(issue.input as string) ?? ""}` });
}

/**
 * Free text of several lines (notes, comments): at most `max` characters,
 * trimmed, line breaks and tabs allowed; when not empty it must be visible and
 * free of bidirectional and other control characters.
 *
 * @example
 * ```ts
 * multilineText("notes", { max: 5000 }).parse(" Dried overnight\nat 60 °C "); // "Dried overnight\nat 60 °C"
 * ```
 */
export function multilineText(label: string, opts: { max: number }): z.ZodType<string, string> {
  return z
    .string({ error: required(label, "text") })
    .trim()
    .max(opts.max, { error: `${label} must be at most ${opts.max} characters` })
    .superRefine((value, ctx) => {
      const problem = textProblem(value, { multiline: true });
      if (problem) ctx.addIssue({ code: "custom", message: `${label} ${problem}` });
    });
}
