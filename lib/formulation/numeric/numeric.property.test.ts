/**
 * The numeric path against the decimal engine, on thousands of random valid
 * inputs (fast-check): every figure within 1e-9 relative (|a − b| ≤ 1e-9 ·
 * max(|a|, |b|), differences ≤ 1e-12 taken as 0), NaN exactly where the engine
 * has no value, the same thermal verdict, and a refusal exactly where the
 * engine refuses, with the same code and field; and the same again when one
 * model evaluates many inputs in turn (it reuses its scratch state). The decimal engine is the
 * reference here: its equations are checked against published sources in
 * the worked-example tests.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { FormulationInput } from "../input-schema";
import { parseFormulationInput } from "../validate";
import { figuresDifference, SCALAR_FIGURES, type ScalarFigure } from "./compare";
import { decimalModel, type NumericFigures, type NumericOutcome } from "./figures";
import { numericModel } from "./model";
import { allMaterials, formulationInputs } from "./test-arbitraries";

const TOLERANCE = 1e-9;

/** The figures compared: all, or all but the coat figures while the coat path is not wired in. */

/** True when the input schema accepts the input (the numeric path takes valid inputs only). */
function isValid(input: FormulationInput): boolean {
  try {
    parseFormulationInput(input);
    return true;
  } catch {
    return false;
  }
}

/** The input without the materials' texts, for a failure message. */
function describeInput(input: FormulationInput): string {
  return JSON.stringify({ ...input, materials: input.materials.map((m) => m.id + (m.density === undefined ? " (no density)" : "") + (m.molarMass === undefined ? " (no molar mass)" : "")) });
}

function agree(input: FormulationInput): { numeric: NumericOutcome; decimal: NumericOutcome } {
  const decimal = decimalModel(input.materials).evaluate(input);
  const numeric = numericModel(input.materials).evaluate(input);
  if (!decimal.ok) {
    expect(numeric, describeInput(input)).toEqual(decimal);
  } else {
    expect(numeric.ok ? "figures" : `refused ${numeric.code} on ${numeric.field}`, describeInput(input)).toBe("figures");
    if (numeric.ok) {
      const difference = figuresDifference(numeric.figures, decimal.figures, SCALAR_FIGURES);
      const show = (figures: NumericFigures): string => JSON.stringify(difference.figure.startsWith("phases") ? figures.phases : figures[difference.figure as ScalarFigure]);
      expect(difference.max, `${difference.figure}: numeric ${show(numeric.figures)}, decimal ${show(decimal.figures)}; ${describeInput(input)}`).toBeLessThanOrEqual(TOLERANCE);
    }
  }
  return { numeric, decimal };
}

describe("numeric path vs the decimal engine", () => {
  it("gives every figure within 1e-9, NaN where the engine has none, and the engine's refusals", () => {
    let valid = 0;
    let refused = 0;
    fc.assert(
      fc.property(formulationInputs, (input) => {
        if (!isValid(input)) return;
        valid += 1;
        if (!agree(input).decimal.ok) refused += 1;
      }),
      { numRuns: 1500 },
    );
    // The generator must mostly give valid inputs, and some the engine refuses.
    expect(valid).toBeGreaterThan(1200);
    expect(refused).toBeGreaterThan(15);
    expect(refused).toBeLessThan(valid / 4);
  });

  it("gives the same figures when one model evaluates many inputs in turn, as the explorer does", () => {
    const materials = allMaterials();
    const model = numericModel(materials);
    const reference = decimalModel(materials);
    let compared = 0;
    fc.assert(
      fc.property(fc.array(formulationInputs, { minLength: 4, maxLength: 4 }), (list) => {
        for (const one of list) {
          const input = { ...one, materials };
          if (!isValid(input)) continue;
          compared += 1;
          const numeric = model.evaluate(input);
          const decimal = reference.evaluate(input);
          if (!decimal.ok || !numeric.ok) expect(numeric, describeInput(input)).toEqual(decimal);
          else expect(figuresDifference(numeric.figures, decimal.figures).max, describeInput(input)).toBeLessThanOrEqual(TOLERANCE);
        }
      }),
      { numRuns: 100 },
    );
    expect(compared).toBeGreaterThan(300);
  });
});
