/**
 * The layout of the numeric kernel's plan (kernel-plan.ts, kernel.ts): the
 * codes of the knobs and the coefficients interleaved per component, and
 * the plain arrays that hold them.
 */

/** Knob codes of the kernel (per knob, what it sets). */
export const KNOB_WEIGHT = 0;
export const KNOB_WATER = 1;
export const KNOB_SOLIDS = 2;
export const KNOB_STEP = 3;
export const KNOB_SPEED = 4;

/** Per component coefficients, interleaved in KernelPlan.coef (STRIDE numbers per component), per g of residue. */
export const C_MASS = 0;
export const C_VOLUME = 1;
export const C_ATOMS = 2;
export const C_GROUPS = 3;
export const C_WATER = 4;
export const C_SOLVENT = 5;
export const C_VOC = 6;
export const C_EPOXY = 7;
export const C_AMINE = 8;
/** g × price per kg (NaN without a price, so that the cost comes out NaN: absent). */
export const C_COST = 9;
/** Per unit weight fraction: 1 / ρ_phase, the same for organic phases only, 1 for organic phases, organic share, Lorentz–Lorenz term / ρ. */
export const C_SPECIFIC = 10;
export const C_ORGANIC_SPECIFIC = 11;
export const C_ORGANIC = 12;
export const C_SHARE = 13;
export const C_OPTICS = 14;
/** mol of precursor per g of residue (0 for other components), g/cm³ of the dry phase, conversion temperature (°C, NaN when none). */
export const C_MOLES = 15;
export const C_PHASE_DENSITY = 16;
export const C_CONVERSION = 17;
export const STRIDE = 18;

/**
 * n zeros in a plain array whose elements are doubles from the start (so every plan's arrays have the
 * same kind and the kernel stays monomorphic); a small typed array costs more to make than a point.
 *
 * @example
 * ```ts
 * zeros(3); // [0, 0, 0]
 * ```
 */
export function zeros(n: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(0.5);
  return out.fill(0);
}
