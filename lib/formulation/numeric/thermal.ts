/**
 * The thermal verdict of the numeric path: the same rules as the engine's
 * checkThermal (lib/formulation/thermal.ts) — hard limits by atmosphere,
 * soft limits by stage, the margin, conversions not reached — reduced to
 * what an exploration plots: the overall status and the highest allowed step
 * temperature. Each material's limits are read once (thermalProfile).
 */
import type { ProcessStep } from "../input-schema";
import type { Material } from "../material-schema";
import type { ThermalStatus } from "../result-types";
import { hardLimit } from "../thermal";

/** A material's limits as plain numbers, °C (NaN: no such limit; +Infinity: no soft limit at that stage). */
export interface ThermalProfile {
  /** True when the engine checks the material at all (it has some limit). */
  readonly checked: boolean;
  /** Lowest hard limit in air / in inert gas. */
  readonly hardAir: number;
  readonly hardInert: number;
  /** Lowest soft limit (melting, glass transition, service rating) per stage: sol, drying, curing. */
  readonly softSol: number;
  readonly softDrying: number;
  readonly softCuring: number;
}

function softLimits(material: Material, stage: "sol" | "drying" | "curing"): number[] {
  const t = material.thermal;
  if (!t) return [];
  const out: number[] = [];
  if (material.kind === "substrate") {
    if (t.heatDeflectionC !== undefined && t.maxServiceC !== undefined) out.push(t.maxServiceC);
    if (t.glassTransitionC !== undefined && t.meltingC === undefined) out.push(t.glassTransitionC);
  } else {
    if (t.meltingC !== undefined && stage !== "sol") out.push(t.meltingC);
    const onlyTg = t.glassTransitionC !== undefined && t.meltingC === undefined && t.degradationOnsetC === undefined && t.degradationOnsetInertC === undefined;
    if (onlyTg && stage === "curing") out.push(t.glassTransitionC!);
  }
  return out;
}

const lowest = (values: number[]): number => values.reduce((a, b) => Math.min(a, b), Number.POSITIVE_INFINITY);

/**
 * The limits of an organic phase or a substrate, read once.
 *
 * @param material - an organic or substrate material
 * @returns its profile
 * @example
 * ```ts
 * thermalProfile(polycarbonate).hardAir; // 132 (heat deflection)
 * ```
 */
export function thermalProfile(material: Material): ThermalProfile {
  const subject = {
    materialId: material.id,
    name: material.name,
    role: material.kind === "substrate" ? ("substrate" as const) : ("organic" as const),
    thermal: material.thermal,
    path: "",
  };
  const air = hardLimit(subject, "air");
  const inert = hardLimit(subject, "inert");
  const softCuring = softLimits(material, "curing");
  return {
    checked: air !== undefined || softCuring.length > 0,
    hardAir: air?.limitC ?? Number.NaN,
    hardInert: inert?.limitC ?? Number.NaN,
    softSol: lowest(softLimits(material, "sol")),
    softDrying: lowest(softLimits(material, "drying")),
    softCuring: lowest(softCuring),
  };
}

const FAIL = 2;
const CAUTION = 1;
const STATUS: readonly ThermalStatus[] = ["clear", "caution", "fail"];

function stepRank(profile: ThermalProfile, step: ProcessStep, marginC: number): number {
  const t = step.temperatureC;
  const hard = step.atmosphere === "inert" ? profile.hardInert : profile.hardAir;
  if (t >= hard) return FAIL; // false for NaN
  if (t >= hard - marginC) return CAUTION;
  const stage = step.stage ?? "curing";
  const soft = stage === "sol" ? profile.softSol : stage === "drying" ? profile.softDrying : profile.softCuring;
  return t >= soft ? CAUTION : 0;
}

/** The verdict of one point. */
export interface ThermalVerdict {
  status: ThermalStatus;
  /** °C, NaN when no checked material has a hard limit. */
  maxAllowedC: number;
}

/**
 * The overall thermal status and highest allowed step temperature of a point.
 *
 * @param subjects - profiles of the organic phases present and the substrate
 * @param conversionsC - conversion temperatures of the precursors present, °C
 * @param steps - the process steps
 * @param marginC - the caution margin, °C
 * @example
 * ```ts
 * thermalVerdict([thermalProfile(polycarbonate)], [], [{ name: "Cure", temperatureC: 120, durationH: 2 }], 20);
 * // { status: "caution", maxAllowedC: 112 }
 * ```
 */
export function thermalVerdict(
  subjects: readonly ThermalProfile[],
  conversionsC: readonly number[],
  steps: readonly ProcessStep[],
  marginC: number,
): ThermalVerdict {
  let allInert = steps.length > 0;
  let hottest: ProcessStep | undefined;
  for (const step of steps) {
    if (step.atmosphere !== "inert") allInert = false;
    if (!hottest || step.temperatureC > hottest.temperatureC) hottest = step;
  }
  let rank = 0;
  let maxAllowedC = Number.NaN;
  for (const profile of subjects) {
    if (!profile.checked) continue;
    const hard = allInert ? profile.hardInert : profile.hardAir;
    if (!Number.isNaN(hard)) {
      const cautionFrom = hard - marginC;
      if (Number.isNaN(maxAllowedC) || cautionFrom < maxAllowedC) maxAllowedC = cautionFrom;
    }
    for (const step of steps) if (rank < FAIL) rank = Math.max(rank, stepRank(profile, step, marginC));
  }
  for (const conversionC of conversionsC) {
    if (!(hottest !== undefined && hottest.temperatureC >= conversionC)) rank = Math.max(rank, CAUTION);
  }
  return { status: STATUS[rank] as ThermalStatus, maxAllowedC };
}
