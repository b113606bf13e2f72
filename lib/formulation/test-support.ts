/**
 * Helpers shared by the engine's unit tests (not part of the engine's API).
 */
import { expect } from "vitest";
import { referenceMaterials } from "../../data/materials";
import type { Material } from "./material-schema";
import type { FormulationResult, RecipeLine } from "./result-types";

/**
 * Asserts |actual − expected| ≤ rel · |expected| (or ≤ rel when expected is 0).
 *
 * @example
 * ```ts
 * expectClose(0.1 + 0.2, 0.3); // passes
 * ```
 */
export function expectClose(actual: number | undefined, expected: number, rel = 1e-12, label = ""): void {
  expect(actual, label).toBeTypeOf("number");
  const scale = Math.max(Math.abs(expected), 1e-300);
  const error = Math.abs((actual as number) - expected) / (expected === 0 ? 1 : scale);
  expect(error, `${label} actual ${actual} expected ${expected}`).toBeLessThanOrEqual(rel);
}

/**
 * A reference material by id (throws when absent).
 *
 * @example
 * ```ts
 * ref("teos").molarMass; // 208.329
 * ```
 */
export function ref(id: string): Material {
  const found = referenceMaterials.find((material) => material.id === id);
  if (!found) throw new Error(`no reference material ${id}`);
  return found;
}

/**
 * The recipe line of a material (throws when absent).
 *
 * @example
 * ```ts
 * line(result, "teos").massGrams;
 * ```
 */
export function line(result: FormulationResult, materialId: string): RecipeLine {
  const found = result.lines.find((l) => l.materialId === materialId);
  if (!found) throw new Error(`no line for ${materialId}`);
  return found;
}

/**
 * Every number anywhere in a value (deep), for NaN / Infinity checks.
 *
 * @example
 * ```ts
 * allNumbers({ a: 1, b: [2, { c: 3 }] }); // [1, 2, 3]
 * ```
 */
export function allNumbers(value: unknown): number[] {
  if (typeof value === "number") return [value];
  if (Array.isArray(value)) return value.flatMap(allNumbers);
  if (value && typeof value === "object") return Object.values(value).flatMap(allNumbers);
  return [];
}
