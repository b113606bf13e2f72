/**
 * The numbers that may vary from point to point of a many-point evaluation
 * (a sweep, a map), described in formulation terms: a component's weight
 * fraction, the water ratio's value, the solids fraction, a modifier ratio,
 * a step temperature, the dip withdrawal speed. Everything else of the input
 * is the same at every point, so the numeric path resolves it once.
 */
import type { FormulationInput } from "../input-schema";

/** One varied number of the input. Indices are positions in the input's lists. */
export type Knob =
  | { kind: "weightFraction"; component: number }
  | { kind: "waterValue" }
  | { kind: "solidsFraction" }
  | { kind: "modifierRatio"; index: number }
  | { kind: "stepTemperature"; index: number }
  | { kind: "withdrawalSpeed" };

/**
 * The input at one point: `base` with the knobs set to `values` (same order). Parts no knob touches are
 * shared with `base`. A solids fraction applies only to a solids-content basis, a withdrawal speed only
 * to a dip coating (as the explorer's grid does).
 *
 * @param base - the input every point starts from (not changed)
 * @param knobs - what varies
 * @param values - one value per knob: fractions 0–1, mol/mol, °C, mm/s
 * @returns the point's input
 * @example
 * ```ts
 * inputAt(input, [{ kind: "waterValue" }], Float64Array.of(6)).water.value; // 6
 * ```
 */
export function inputAt(base: FormulationInput, knobs: readonly Knob[], values: ArrayLike<number>): FormulationInput {
  const out: FormulationInput = { ...base };
  for (let k = 0; k < knobs.length; k++) {
    const knob = knobs[k]!;
    const value = values[k]!;
    switch (knob.kind) {
      case "weightFraction": {
        if (out.components === base.components) out.components = base.components.slice();
        out.components[knob.component] = { materialId: base.components[knob.component]!.materialId, weightFraction: value };
        break;
      }
      case "waterValue":
        out.water = { ...out.water, value };
        break;
      case "solidsFraction":
        if (out.basis.type === "solidsContent") out.basis = { ...out.basis, solidsFraction: value };
        break;
      case "modifierRatio": {
        const modifiers = (out.modifiers ?? []).slice();
        modifiers[knob.index] = { ...modifiers[knob.index]!, molPerMetal: value };
        out.modifiers = modifiers;
        break;
      }
      case "stepTemperature": {
        const steps = out.steps.slice();
        steps[knob.index] = { ...steps[knob.index]!, temperatureC: value };
        out.steps = steps;
        break;
      }
      case "withdrawalSpeed":
        if (out.coating?.method === "dip") out.coating = { ...out.coating, withdrawalMmPerS: value };
        break;
    }
  }
  return out;
}

/**
 * The input's own value of each knob (NaN where the input has no such number).
 *
 * @example
 * ```ts
 * knobValues(input, [{ kind: "waterValue" }]); // Float64Array [4]
 * ```
 */
export function knobValues(input: FormulationInput, knobs: readonly Knob[]): Float64Array {
  const values = new Float64Array(knobs.length).fill(Number.NaN);
  knobs.forEach((knob, k) => {
    switch (knob.kind) {
      case "weightFraction":
        values[k] = input.components[knob.component]?.weightFraction ?? Number.NaN;
        break;
      case "waterValue":
        values[k] = input.water.value;
        break;
      case "solidsFraction":
        if (input.basis.type === "solidsContent") values[k] = input.basis.solidsFraction;
        break;
      case "modifierRatio":
        values[k] = input.modifiers?.[knob.index]?.molPerMetal ?? Number.NaN;
        break;
      case "stepTemperature":
        values[k] = input.steps[knob.index]?.temperatureC ?? Number.NaN;
        break;
      case "withdrawalSpeed":
        if (input.coating?.method === "dip") values[k] = input.coating.withdrawalMmPerS;
        break;
    }
  });
  return values;
}
