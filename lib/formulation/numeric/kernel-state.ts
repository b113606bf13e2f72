/**
 * The running state of the numeric kernel (kernel.ts): the point's weight
 * fractions, the sums of its lines, and the thermal verdict, recomputed only
 * when the components present or a step temperature change (an invariant of
 * the grid otherwise, computed once: not a cache of results by input).
 */
import type { ProcessStep } from "../input-schema";
import * as layout from "./kernel-layout";
import type { KernelPlan, LineCoefficients } from "./kernel-plan";
import { thermalVerdict, type ThermalProfile } from "./thermal";

// Read once (an imported binding is a getter where modules are compiled one by one).
const { C_CONVERSION, STRIDE, zeros } = layout;
const verdictOf = thermalVerdict;

/** Scratch of one kernel: the point's weight fractions (scaled to 1) and the hoisted thermal verdict. */
export interface KernelState {
  /** w_i of the last point, as the phases hold them. */
  readonly w: number[];
  /** Bit i set when thermal component i is present; −1 before the first point. */
  mask: number;
  status: number;
  maxAllowedC: number;
  readonly sums: Sums;
}

/**
 * Fresh scratch for a plan.
 *
 * @example
 * ```ts
 * const state = kernelState(plan);
 * ```
 */
export function kernelState(plan: KernelPlan): KernelState {
  const sums: Sums = { mass: 0, volume: 0, water: 0, solvent: 0, voc: 0, cost: 0, priced: 0, epoxy: 0, amine: 0 };
  return { w: zeros(plan.n), mask: -1, status: 0, maxAllowedC: Number.NaN, sums };
}

/** Sums of the lines other than the components. */
export interface Sums {
  mass: number;
  volume: number;
  water: number;
  solvent: number;
  voc: number;
  cost: number;
  priced: number;
  epoxy: number;
  amine: number;
}

/**
 * Adds a catalyst, solvent or water line of `grams` to the sums.
 *
 * @example
 * ```ts
 * addLine(state.sums, plan.waterLine, 7.2, 7.21);
 * ```
 */
export function addLine(s: Sums, line: LineCoefficients, grams: number, volume: number): void {
  s.mass += grams;
  s.volume += volume;
  s.water += grams * line.waterMolPerGram;
  s.solvent += grams * line.solventPerGram;
  s.voc += grams * line.vocPerGram;
  if (grams > 0) {
    s.priced += 1;
    s.cost += grams * line.price;
  }
  s.epoxy += grams * line.epoxyPerGram;
  s.amine += grams * line.aminePerGram;
}

const STATUS_RANK: Record<string, number> = { clear: 0, caution: 1, fail: 2 };
const subjects: ThermalProfile[] = [];
const conversions: number[] = [];

/** The thermal verdict of the point, recomputed only when the present subjects or the steps change. */
/**
 * Sets the state's thermal verdict for the present components of `w`.
 *
 * @example
 * ```ts
 * thermal(plan, state, state.w); // state.status, state.maxAllowedC
 * ```
 */
export function thermal(plan: KernelPlan, state: KernelState, w: readonly number[]): void {
  const list = plan.thermalComponents;
  let mask = 0;
  for (let k = 0; k < list.length && k < 30; k++) if (w[list[k]!] !== 0) mask |= 1 << k;
  if (mask === state.mask && !plan.stepsVary && list.length <= 30) return;
  subjects.length = 0;
  conversions.length = 0;
  for (let k = 0; k < list.length; k++) {
    const i = list[k]!;
    if (w[i] === 0) continue;
    const subject = plan.subject[i];
    if (subject) subjects.push(subject);
    else conversions.push(plan.coef[i * STRIDE + C_CONVERSION]!);
  }
  if (plan.substrate) subjects.push(plan.substrate);
  const verdict = verdictOf(subjects, conversions, plan.steps as readonly ProcessStep[], plan.marginC);
  state.mask = mask;
  state.status = STATUS_RANK[verdict.status]!;
  state.maxAllowedC = verdict.maxAllowedC;
}

