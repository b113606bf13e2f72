import { z } from "zod";

type Issue = { readonly input?: unknown };

/**
 * Error callback for a required value of a given shape: "x is required" when
 * absent, "x must be …" otherwise.
 *
 * @example
 * ```ts
 * z.string({ error: required("name", "text") });
 * ```
 */
export function required(label: string, expected: string): (issue: Issue) => string {
  return (issue) => (issue.input === undefined || issue.input === null ? `${label} is required` : `${label} must be ${expected}`);
}

/**
 * A finite number (zod 4 rejects NaN and ±Infinity) with plain messages.
 *
 * @example
 * ```ts
 * finiteNumber("temperature (°C)").parse(25); // 25
 * ```
 */
export function finiteNumber(label: string): z.ZodNumber {
  return z.number({ error: required(label, "a finite number") });
}

/**
 * A finite number within [min, max] (inclusive), with a plain message.
 *
 * @example
 * ```ts
 * rangedNumber("density (g/cm³)", { min: 0.001, max: 30 }).parse(0.933); // 0.933
 * ```
 */
export function rangedNumber(label: string, range: { readonly min: number; readonly max: number }): z.ZodNumber {
  const message = `${label} must be between ${range.min} and ${range.max}`;
  return finiteNumber(label).min(range.min, { error: message }).max(range.max, { error: message });
}

/**
 * Exactly 0, or a finite number within [min, max] (inclusive).
 *
 * @example
 * ```ts
 * zeroOrRangedNumber("weight fraction", { min: 1e-6, max: 1 }).parse(0); // 0
 * ```
 */
export function zeroOrRangedNumber(
  label: string,
  range: { readonly min: number; readonly max: number },
): z.ZodType<number, number> {
  const message = `${label} must be 0 or between ${range.min} and ${range.max}`;
  return finiteNumber(label).refine((value) => value === 0 || (value >= range.min && value <= range.max), { error: message });
}

/**
 * A number strictly greater than 0.
 *
 * @example
 * ```ts
 * positiveNumber("density (g/cm³)").parse(0.933); // 0.933
 * ```
 */
export function positiveNumber(label: string): z.ZodNumber {
  return finiteNumber(label).positive({ error: `${label} must be greater than 0` });
}

/**
 * A number greater than or equal to 0.
 *
 * @example
 * ```ts
 * nonNegativeNumber("duration (h)").parse(0); // 0
 * ```
 */
export function nonNegativeNumber(label: string): z.ZodNumber {
  return finiteNumber(label).min(0, { error: `${label} must not be negative` });
}

/**
 * A mass fraction in [0, 1], or in [0, 1) when `openAtOne` is set.
 *
 * @example
 * ```ts
 * fraction("water fraction", true).parse(0.63); // 0.63
 * ```
 */
export function fraction(label: string, openAtOne = false): z.ZodNumber {
  const base = nonNegativeNumber(label);
  return openAtOne
    ? base.lt(1, { error: `${label} must be below 1` })
    : base.max(1, { error: `${label} must not exceed 1` });
}

/**
 * A non-empty string; `whenEmpty` is the message for "" (default "<label> must not be empty").
 *
 * @example
 * ```ts
 * nonEmptyString("component material", "choose a material").parse("teos"); // "teos"
 * ```
 */
export function nonEmptyString(label: string, whenEmpty = `${label} must not be empty`): z.ZodString {
  return z.string({ error: required(label, "text") }).min(1, { error: whenEmpty });
}

/**
 * Joins a zod issue path into the dot-separated field path used by
 * FormulationError, e.g. ["materials", 3, "density"] → "materials.3.density".
 *
 * @example
 * ```ts
 * fieldPath(["components", 2, "weightFraction"]); // "components.2.weightFraction"
 * ```
 */
export function fieldPath(path: readonly PropertyKey[]): string {
  return path.map((key) => String(key)).join(".");
}
