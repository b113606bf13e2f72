/**
 * The numeric coat figures against the decimal engine, checked with
 * fast-check on random valid formulations (coat-arbitraries.ts): every coat
 * figure within 1e-9 relative of computeFormulation's, NaN exactly where the
 * engine leaves the field out, and the engine's refusal (code and field)
 * where its coat predictions refuse the input.
 *
 * The engine's own coat step is wrapped (not changed) to capture the
 * decimal context it is given, so that a point the coat step refuses, which
 * leaves no result, can still be handed to numericCoat.
 *
 * COAT_RUNS=4000 npx vitest run lib/formulation/numeric/coat.test.ts runs more random formulations (default 300).
 */
import fc from "fast-check";
import { describe, expect, it, vi } from "vitest";
import type { CoatContext } from "../coat";
import { computeFormulation } from "../compute";
import { isFormulationError } from "../errors";
import type { FormulationInput } from "../input-schema";
import type { FormulationResult } from "../result-types";
import { aqueousCaseArb, coatCaseArb } from "./coat-arbitraries";
import { coatContextFromDecimal, coatContextFromResult, coatFiguresOf, expectCoatFiguresClose } from "./coat-test-support";
import { numericCoat } from "./coat";
import type { NumericCoatFigures } from "./context";
import type { NumericFailure } from "./figures";

type Captured = { result?: FormulationResult; context?: Parameters<typeof coatContextFromDecimal>[1]; threw?: unknown };
const captured = vi.hoisted((): { last: Captured } => ({ last: {} }));

vi.mock("../coat", async (importOriginal) => {
  const original = await importOriginal<typeof import("../coat")>();
  return {
    ...original,
    addCoatPredictions(result: FormulationResult, context: CoatContext): void {
      // the alcohols come as a one-shot iterator: read them once, pass the list on
      const listed = { ...context, alcohols: [...context.alcohols] };
      captured.last = { result: structuredClone(result), context: listed };
      try {
        original.addCoatPredictions(result, listed);
      } catch (error) {
        captured.last.threw = error;
        throw error;
      }
    },
  };
});

const REL = 1e-9;

type Engine = { ok: true; result: FormulationResult } | { ok: false; code: string; field: string; inCoat: boolean };

/** The decimal engine on an input, noting whether a refusal came from its coat step. */
function engine(input: FormulationInput): Engine {
  captured.last = {};
  try {
    return { ok: true, result: computeFormulation(input) };
  } catch (error) {
    if (!isFormulationError(error)) throw error;
    return { ok: false, code: error.code, field: error.field, inCoat: captured.last.threw === error };
  }
}

function figures(outcome: NumericCoatFigures | NumericFailure): NumericCoatFigures {
  if ("ok" in outcome) throw new Error(`numericCoat refused: ${outcome.code} on ${outcome.field}`);
  return outcome;
}

/** Both contexts (from the result, and from the decimal context the coat step got) give the engine's figures. */
function expectSameAsEngine(input: FormulationInput, result: FormulationResult): NumericCoatFigures {
  const expected = coatFiguresOf(result, input.materials);
  const fromResult = figures(numericCoat(coatContextFromResult(input, result)));
  expectCoatFiguresClose(fromResult, expected, REL);
  const { result: before, context } = captured.last;
  if (!before || !context) throw new Error("the coat step was not reached");
  expectCoatFiguresClose(figures(numericCoat(coatContextFromDecimal(before, context))), expected, REL);
  return fromResult;
}

describe("numeric coat figures: the decimal engine's, on random formulations", () => {
  it("gives every coat figure within 1e-9 of the engine, NaN exactly where the engine has none", () => {
    const seen = { coating: 0, optics: 0, opticsAbsent: 0, mismatch: 0, cure: 0, cost: 0, costPerM2: 0, porous: 0 };
    fc.assert(
      fc.property(coatCaseArb, (c) => {
        const dense = engine(c.input);
        // points the engine refuses before its coat step are not coat cases
        fc.pre(dense.ok || dense.inCoat);
        let input = c.input;
        let outcome = dense;
        if (dense.ok && c.porosity !== undefined) {
          input = { ...c.input, measuredBulkDensity: dense.result.composite.theoreticalDensity * (1 - c.porosity) };
          outcome = engine(input);
        }
        if (!outcome.ok) {
          const failure = numericCoat(coatContextFromDecimal(captured.last.result!, captured.last.context!));
          expect(failure).toEqual({ ok: false, code: outcome.code, field: outcome.field });
          return;
        }
        const got = expectSameAsEngine(input, outcome.result);
        if (!Number.isNaN(got.wetThicknessUm)) seen.coating += 1;
        if (Number.isNaN(got.refractiveIndex)) seen.opticsAbsent += 1;
        else seen.optics += 1;
        if (!Number.isNaN(got.indexMismatch)) seen.mismatch += 1;
        if (!Number.isNaN(got.cureRatio)) seen.cure += 1;
        if (!Number.isNaN(got.costTotal)) seen.cost += 1;
        if (!Number.isNaN(got.costPerM2)) seen.costPerM2 += 1;
        if (input.measuredBulkDensity !== undefined) seen.porous += 1;
      }),
      { numRuns: Number(process.env.COAT_RUNS ?? 300) },
    );
    // the random formulations reached every kind of figure, present and absent
    for (const [kind, count] of Object.entries(seen)) expect(count, kind).toBeGreaterThan(0);
  }, 120_000);

  it("refuses what the engine's VOC figure refuses, with its code and field, and agrees where it does not", () => {
    const seen = { refused: 0, missingDensity: 0, computed: 0 };
    fc.assert(
      fc.property(aqueousCaseArb, (input) => {
        const outcome = engine(input);
        fc.pre(outcome.ok || outcome.inCoat);
        if (outcome.ok) {
          seen.computed += 1;
          expectSameAsEngine(input, outcome.result);
          return;
        }
        seen.refused += 1;
        if (outcome.code === "missing_density") seen.missingDensity += 1;
        const failure = numericCoat(coatContextFromDecimal(captured.last.result!, captured.last.context!));
        expect(failure).toEqual({ ok: false, code: outcome.code, field: outcome.field });
      }),
      { numRuns: 200 },
    );
    expect(seen.refused).toBeGreaterThan(0);
    expect(seen.missingDensity).toBeGreaterThan(0);
    expect(seen.computed).toBeGreaterThan(0);
  });
});
