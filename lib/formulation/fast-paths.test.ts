/**
 * The character loops that replaced regular expressions and rounding on the
 * engine's hot path give the answers of the expressions they replaced, for
 * any text or number: each is checked here against the earlier definition,
 * kept below as the reference, on random input that mixes plain ASCII with
 * control characters, bidirectional controls (Unicode Standard Annex #9),
 * lone and paired UTF-16 surrogates, invisible and white-space characters.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { casCheckDigitValid } from "./material-schema";
import { textProblem } from "./text-rules";
import { showValue } from "./thermal";

// ---- the earlier definitions, as they were ----

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const BIDI_CONTROL = /[\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/;
const CONTROL = /[\u0000-\u001F\u007F-\u009F]/;
const CONTROL_EXCEPT_LINE_BREAKS = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
const INVISIBLE =
  /[\s\p{Z}\p{Cf}\u034F\u115F\u1160\u17B4\u17B5\u180B-\u180F\u2800\u3164\uFE00-\uFE0F\uFFA0\u{E0100}-\u{E01EF}]/gu;
const codePoint = (ch: string): string => `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}`;

function referenceTextProblem(value: string, opts: { multiline?: boolean } = {}): string | null {
  if (/^[\x20-\x7E]*$/.test(value) && /[^ ]/.test(value)) return null;
  if (LONE_SURROGATE.test(value)) return "must not contain a broken character (a lone UTF-16 surrogate)";
  const bidi = BIDI_CONTROL.exec(value);
  if (bidi) return `must not contain the bidirectional control ${codePoint(bidi[0])}`;
  const control = (opts.multiline ? CONTROL_EXCEPT_LINE_BREAKS : CONTROL).exec(value);
  if (control) return `must not contain the control character ${codePoint(control[0])}`;
  if (value.length > 0 && value.replace(INVISIBLE, "").length === 0) return "must contain visible characters";
  return null;
}

function referenceCasCheck(cas: string): boolean {
  const digits = cas.replace(/-/g, "");
  const check = Number(digits.slice(-1));
  const body = digits.slice(0, -1);
  let total = 0;
  for (let i = 0; i < body.length; i += 1) total += Number(body[body.length - 1 - i]) * (i + 1);
  return total % 10 === check;
}

const referenceShow = (value: number): string => String(Number(value.toPrecision(6)));

// ---- random input ----

/** Single UTF-16 code units and pairs that each rule cares about, beside ordinary letters. */
const SPECIAL_UNITS = [
  " ", "\t", "\n", "\r", "\u000B", "\u000C", "\u0000", "\u001B", "\u007F", "\u0085", "\u009F", "\u00A0", "\u00AD",
  "\u034F", "\u061C", "\u115F", "\u17B4", "\u180B", "\u180E", "\u2000", "\u200B", "\u200C", "\u200D", "\u200E", "\u200F",
  "\u2028", "\u2029", "\u202A", "\u202E", "\u202F", "\u2060", "\u2066", "\u2069", "\u206A", "\u2800", "\u3000", "\u3164",
  "\uFE0F", "\uFEFF", "\uFFA0", "\uD83D", "\uDE00", "\uD83D\uDE00", "\uDB40\uDD00", "\uDB40\uDC01", "\u2248", "é", "Ж", "酢",
];

const unit = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...SPECIAL_UNITS) },
  { weight: 3, arbitrary: fc.string({ unit: "binary-ascii", minLength: 1, maxLength: 1 }) },
  { weight: 1, arbitrary: fc.string({ unit: "binary", minLength: 1, maxLength: 1 }) },
  { weight: 1, arbitrary: fc.integer({ min: 0, max: 0xffff }).map((code) => String.fromCharCode(code)) },
);
const text = fc.array(unit, { maxLength: 12 }).map((parts) => parts.join(""));

/** Digits, hyphens and the characters Number() reads as 0 (white space) or NaN. */
const casText = fc
  .array(fc.constantFrom("0", "1", "2", "3", "4", "5", "6", "7", "8", "9", "-", "-", " ", "\u00A0", "\u3000", "\uFEFF", "x", "+", ".", "٣", "e"), {
    maxLength: 14,
  })
  .map((parts) => parts.join(""));

describe("textProblem's loop over code units", () => {
  it("answers as the regular expressions did, single-line and multi-line, for any text", () => {
    fc.assert(
      fc.property(text, (value) => {
        expect(textProblem(value)).toBe(referenceTextProblem(value));
        expect(textProblem(value, { multiline: true })).toBe(referenceTextProblem(value, { multiline: true }));
      }),
      { numRuns: 20000 },
    );
  });

  it("answers as they did for each special unit alone, with letters around it, and repeated", () => {
    for (const special of SPECIAL_UNITS) {
      for (const value of [special, `a${special}`, `${special}b`, `a${special}b`, `${special}${special}`, ` ${special} `]) {
        expect(textProblem(value), JSON.stringify(value)).toBe(referenceTextProblem(value));
        expect(textProblem(value, { multiline: true }), JSON.stringify(value)).toBe(referenceTextProblem(value, { multiline: true }));
      }
    }
  });
});

describe("casCheckDigitValid's loop over character codes", () => {
  it("answers as the earlier definition did for digits, hyphens, white space and other characters", () => {
    fc.assert(
      fc.property(casText, (cas) => {
        expect(casCheckDigitValid(cas)).toBe(referenceCasCheck(cas));
      }),
      { numRuns: 20000 },
    );
  });

  it("answers as it did for any text at all, and for registry numbers of every length", () => {
    fc.assert(
      fc.property(text, (cas) => {
        expect(casCheckDigitValid(cas)).toBe(referenceCasCheck(cas));
      }),
      { numRuns: 5000 },
    );
    fc.assert(
      fc.property(fc.stringMatching(/^\d{2,7}-\d{2}-\d$/), (cas) => {
        expect(casCheckDigitValid(cas)).toBe(referenceCasCheck(cas));
      }),
      { numRuns: 5000 },
    );
    // water (7732-18-5) and ethanol (64-17-5) pass; a wrong check digit fails; "" and "--" have no digit (0 = 0)
    expect([casCheckDigitValid("7732-18-5"), casCheckDigitValid("64-17-5"), casCheckDigitValid("64-17-6")]).toEqual([true, true, false]);
    expect([casCheckDigitValid(""), casCheckDigitValid("--")]).toEqual([referenceCasCheck(""), referenceCasCheck("--")]);
  });
});

describe("showValue", () => {
  it("prints every number as rounding to 6 significant digits did", () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.integer({ min: -2_000_000, max: 2_000_000 }),
          fc.constantFrom(0, -0, 999_999, -999_999, 1_000_000, -1_000_000, 1_234_567, 2 ** 53, -(2 ** 53), 1e21, 1e-7),
          fc.double({ noNaN: true }),
          fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        ),
        (value) => {
          expect(showValue(value)).toBe(referenceShow(value));
        },
      ),
      { numRuns: 20000 },
    );
  });
});
