/**
 * The explorer's prepared numeric path (knob values per point, the numeric
 * model's evaluator: kernel or general branch) against pointInput and the
 * decimal engine, point by point, on random valid inputs (the numeric
 * path's arbitraries) and random grids: one or two variables of every kind,
 * or a ternary map. Every figure within 1e-9 relative (compare.ts), NaN
 * exactly where the engine has none, the same thermal status and the same
 * refusals (code and field). The decimal engine is the reference; its
 * equations are checked against published sources in its worked examples.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { FormulationInput } from "../formulation/input-schema";
import { relativeDifference } from "../formulation/numeric/compare";
import { decimalModel } from "../formulation/numeric/figures";
import { kernelPlan } from "../formulation/numeric/kernel-plan";
import { materialTable } from "../formulation/numeric/material-table";
import { numericModel } from "../formulation/numeric/model";
import { formulationInputs } from "../formulation/numeric/test-arbitraries";
import { parseFormulationInput } from "../formulation/validate";
import { isPlanError, planGrid } from "./grid";
import { inputAt } from "../formulation/numeric/knobs";
import { isPointRefusal, pointInput } from "./apply";
import { knobPlan, pointKnobs } from "./apply";
import { outputCatalogue } from "./outputs";
import { runExplorationSync } from "./run";
import type { Grid, Variable } from "./spec";

const TOLERANCE = 1e-9;

function isValid(input: FormulationInput): boolean {
  try {
    parseFormulationInput(input);
    return true;
  } catch {
    return false;
  }
}

/** A range of 2–6 values from `from`, at most `span` wide. */
const range = (min: number, max: number, span: number) =>
  fc.record({ from: fc.double({ min, max, noNaN: true }), width: fc.double({ min: span / 20, max: span, noNaN: true }), count: fc.integer({ min: 2, max: 6 }) }).map((r) => ({
    from: r.from,
    to: r.from + r.width,
    step: r.width / (r.count - 1),
  }));

/** The variables `input` can vary (planGrid refuses the others). */
function variables(input: FormulationInput): fc.Arbitrary<Variable> {
  const options: fc.Arbitrary<Variable>[] = [
    fc.tuple(fc.nat(input.components.length - 1), range(0, 0.9, 0.5)).map(([c, r]) => ({ kind: "weightFraction" as const, materialId: input.components[c]!.materialId, ...r })),
    range(0.2, 12, 8).map((r) => ({ kind: "waterRatio" as const, ...r })),
  ];
  if (input.basis.type === "solidsContent") options.push(range(0.01, 0.3, 0.3).map((r) => ({ kind: "solidsContent" as const, ...r })));
  const modifiers = input.modifiers?.length ?? 0;
  if (modifiers > 0) options.push(fc.tuple(fc.nat(modifiers - 1), range(0, 2, 2)).map(([index, r]) => ({ kind: "modifierRatio" as const, index, ...r })));
  if (input.steps.length > 0) options.push(fc.tuple(fc.nat(input.steps.length - 1), range(20, 400, 250)).map(([index, r]) => ({ kind: "stepTemperature" as const, index, ...r })));
  if (input.coating?.method === "dip") options.push(range(0.1, 20, 20).map((r) => ({ kind: "withdrawalSpeed" as const, ...r })));
  return fc.oneof(...options);
}

function grids(input: FormulationInput): fc.Arbitrary<Grid> {
  const sweep = fc.array(variables(input), { minLength: 1, maxLength: 2 }).map((list): Grid => ({ kind: "sweep", variables: list }));
  const n = input.components.length;
  if (n < 3) return sweep;
  const ternary = fc
    .tuple(fc.shuffledSubarray([...Array(n).keys()], { minLength: 3, maxLength: 3 }), fc.constantFrom(0.5, 0.25, 0.2))
    .map(([ids, step]): Grid => ({ kind: "ternary", materialIds: ids.map((i) => input.components[i]!.materialId) as [string, string, string], step }));
  return fc.oneof(sweep, ternary);
}

const cases = formulationInputs.filter(isValid).chain((input) => grids(input).map((grid) => ({ input, grid })));

describe("the explorer's prepared numeric path vs pointInput and the decimal engine", () => {
  it("gives every point's figures within 1e-9, its thermal status and its refusal", () => {
    let points = 0;
    let kernelRuns = 0;
    let refusals = 0;
    const kinds = new Set<string>();
    fc.assert(
      fc.property(cases, ({ input, grid }) => {
        const plan = planGrid(grid, input);
        if (isPlanError(plan)) return;
        const outputs = outputCatalogue(input).map((o) => o.key);
        const run = (model: typeof reference) => runExplorationSync({ base: input, plan, outputs, model });
        const reference = decimalModel(input.materials);
        const decimal = run(reference);
        const numeric = run(numericModel(input.materials));
        const where = JSON.stringify({ grid, input: { ...input, materials: input.materials.map((m) => m.id) } });
        expect(numeric.refusals, where).toEqual(decimal.refusals);
        expect([...numeric.status], where).toEqual([...decimal.status]);
        decimal.outputs.forEach((key, o) => {
          for (let p = 0; p < plan.count; p++) {
            const a = decimal.values[o]![p]!;
            const b = numeric.values[o]![p]!;
            expect(relativeDifference(a, b), `${key} at point ${p}: decimal ${a}, numeric ${b}; ${where}`).toBeLessThanOrEqual(TOLERANCE);
          }
        });
        points += plan.count;
        refusals += decimal.refusals.length;
        if (kernelPlan(materialTable(input.materials), input, knobPlan(input, plan).knobs)) kernelRuns += 1;
        kinds.add(grid.kind === "ternary" ? "ternary" : grid.variables.map((v) => v.kind).join("+"));
      }),
      { numRuns: 400 },
    );
    // thousands of points, most grids on the kernel, some refusals, every kind of variable
    expect(points).toBeGreaterThan(2500);
    expect(kernelRuns).toBeGreaterThan(120);
    expect(refusals).toBeGreaterThan(50);
    for (const kind of ["weightFraction", "waterRatio", "solidsContent", "modifierRatio", "stepTemperature", "withdrawalSpeed", "ternary"]) {
      expect([...kinds].some((k) => k.includes(kind)), kind).toBe(true);
    }
  }, 60_000);

  it("sets, through knob values, the same input pointInput makes at every point, and refuses the same points", () => {
    let points = 0;
    fc.assert(
      fc.property(cases, ({ input, grid }) => {
        const plan = planGrid(grid, input);
        if (isPlanError(plan)) return;
        const k = knobPlan(input, plan);
        const values = new Float64Array(k.knobs.length);
        for (let p = 0; p < plan.count; p++) {
          const expected = pointInput(input, plan, p);
          const refusal = pointKnobs(input, plan, k, p, values);
          if (isPointRefusal(expected)) expect(refusal).toEqual(expected);
          else {
            expect(refusal).toBeUndefined();
            expect(inputAt(input, k.knobs, values)).toEqual(expected);
          }
          points += 1;
        }
      }),
      { numRuns: 300 },
    );
    expect(points).toBeGreaterThan(2000);
  });
});
