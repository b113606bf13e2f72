/**
 * The thermal limits of a subject (an organic phase or the substrate) and
 * how a process step's stage and atmosphere choose among them: the hard
 * limit (degradation onset in air or inert gas; for a substrate also its
 * heat deflection temperature or service rating, and its melting point) and
 * the soft ones (service rating, glass transition, an organic phase's
 * melting point). The checks of a schedule against them, conversions
 * included, are in thermal.ts.
 */
import type { ProcessStep } from "./input-schema";
import type { ThermalData } from "./material-schema";
import type { ThermalLimit, ThermalStatus } from "./result-types";

/** An organic phase or the substrate, whose limits bound every step. */
export interface ThermalSubject {
  materialId: string;
  name: string;
  role: "organic" | "substrate";
  thermal?: ThermalData;
  /** "materials.N", for notices. */
  path: string;
}

/** A precursor that needs heat to convert to its stated residue. */
export interface ConversionSubject {
  materialId: string;
  name: string;
  residueFormula: string;
  conversionTemperatureC: number;
  path: string;
}

/** A named limit and its temperature, °C. */
export interface NamedLimit {
  limit: ThermalLimit;
  limitC: number;
}

/** Where a step happens: in the liquid sol, while drying, or while curing (annealing included). */
export type StepStage = "sol" | "drying" | "curing";
/** The gas over a step. */
export type StepAtmosphere = "air" | "inert";

/** A step's stage; stored schedules without one keep today's checks ("curing"). */
export const stageOf = (step: Pick<ProcessStep, "stage">): StepStage => step.stage ?? "curing";
/** A step's atmosphere; "air" when not stated. */
export const atmosphereOf = (step: Pick<ProcessStep, "atmosphere">): StepAtmosphere => step.atmosphere ?? "air";

/** Thermal statuses from best to worst, to keep the worst of several checks. */
export const STATUS_RANK: Record<ThermalStatus, number> = { clear: 0, caution: 1, fail: 2 };

/** Words for each thermal limit, in the engine's messages and on the screens and sheets (lib/labels.ts). */
export const LIMIT_LABELS: Record<ThermalLimit, string> = {
  degradationOnset: "degradation onset in air",
  degradationOnsetInert: "degradation onset in inert gas",
  heatDeflection: "heat deflection temperature (1.8 MPa)",
  maxService: "maximum service temperature",
  melting: "melting point",
  glassTransition: "glass transition",
  conversion: "conversion temperature",
};

/** The degradation onset that holds under `atmosphere`: the inert value when known, else the air value. */
function degradation(t: ThermalData, atmosphere: StepAtmosphere): NamedLimit | undefined {
  if (atmosphere === "inert" && t.degradationOnsetInertC !== undefined) {
    return { limit: "degradationOnsetInert", limitC: t.degradationOnsetInertC };
  }
  return t.degradationOnsetC === undefined ? undefined : { limit: "degradationOnset", limitC: t.degradationOnsetC };
}

/**
 * Hard limit H, °C (chemistry: "Thermal compatibility"): a step fails at
 * T ≥ H. For an organic phase, its degradation onset under the step's
 * atmosphere (inert falls back to air). For a substrate, the lowest of its
 * short-term limit (heat deflection temperature at 1.8 MPa, ISO 75-2 method
 * A) — or, when that is unknown, its maximum service temperature —, its
 * degradation onset and its melting point (the part must keep its shape).
 * Undefined when none is known.
 *
 * @param subject - an organic phase or the substrate
 * @param atmosphere - the step's atmosphere, default "air"
 * @example
 * ```ts
 * hardLimit({ materialId: "pc", name: "PC", role: "substrate", path: "materials.0",
 *   thermal: { glassTransitionC: 147, degradationOnsetC: 450, heatDeflectionC: 132, maxServiceC: 125 } });
 * // { limit: "heatDeflection", limitC: 132 }
 * ```
 */
export function hardLimit(subject: ThermalSubject, atmosphere: StepAtmosphere = "air"): NamedLimit | undefined {
  const t = subject.thermal;
  if (!t) return undefined;
  // candidates in this order, the first of equal ones kept: degradation, short-term (or service) limit, melting
  let lowest = degradation(t, atmosphere);
  if (subject.role === "substrate") {
    if (t.heatDeflectionC !== undefined) {
      if (!lowest || t.heatDeflectionC < lowest.limitC) lowest = { limit: "heatDeflection", limitC: t.heatDeflectionC };
    } else if (t.maxServiceC !== undefined) {
      if (!lowest || t.maxServiceC < lowest.limitC) lowest = { limit: "maxService", limitC: t.maxServiceC };
    }
    if (t.meltingC !== undefined && (!lowest || t.meltingC < lowest.limitC)) lowest = { limit: "melting", limitC: t.meltingC };
  }
  return lowest;
}

/**
 * The limits that bring a caution (not a failure) in a step of this stage:
 * a substrate's continuous-use rating when a short-term limit is also known,
 * an amorphous substrate's glass transition (one without a melting point),
 * an organic phase's melting point in drying and curing, and the glass
 * transition of an organic phase known by nothing else, in curing.
 */
export function softLimits(subject: ThermalSubject, stage: StepStage): NamedLimit[] {
  const t = subject.thermal;
  if (!t) return [];
  const out: NamedLimit[] = [];
  if (subject.role === "substrate") {
    if (t.heatDeflectionC !== undefined && t.maxServiceC !== undefined) out.push({ limit: "maxService", limitC: t.maxServiceC });
    if (t.glassTransitionC !== undefined && t.meltingC === undefined) out.push({ limit: "glassTransition", limitC: t.glassTransitionC });
  } else {
    if (t.meltingC !== undefined && stage !== "sol") out.push({ limit: "melting", limitC: t.meltingC });
    const onlyTg = t.glassTransitionC !== undefined && t.meltingC === undefined && t.degradationOnsetC === undefined && t.degradationOnsetInertC === undefined;
    if (onlyTg && stage === "curing") out.push({ limit: "glassTransition", limitC: t.glassTransitionC! });
  }
  return out;
}

/** The limit a row names when nothing was passed: the hard limit in air, else the first soft limit of any stage. */
export function anyLimit(subject: ThermalSubject): NamedLimit | undefined {
  return hardLimit(subject, "air") ?? softLimits(subject, "curing")[0];
}
