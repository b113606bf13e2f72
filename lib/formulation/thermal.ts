import { Dec } from "./decimal";
import type { ProcessStep } from "./input-schema";
import type { ThermalData } from "./material-schema";
import type { Notice, ThermalCheck, ThermalLimit, ThermalResult, ThermalStatus } from "./result-types";

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

const STATUS_RANK: Record<ThermalStatus, number> = { clear: 0, caution: 1, fail: 2 };

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
  const candidates: NamedLimit[] = [];
  const td = degradation(t, atmosphere);
  if (td) candidates.push(td);
  if (subject.role === "substrate") {
    if (t.heatDeflectionC !== undefined) candidates.push({ limit: "heatDeflection", limitC: t.heatDeflectionC });
    else if (t.maxServiceC !== undefined) candidates.push({ limit: "maxService", limitC: t.maxServiceC });
    if (t.meltingC !== undefined) candidates.push({ limit: "melting", limitC: t.meltingC });
  }
  let lowest: NamedLimit | undefined;
  for (const candidate of candidates) if (!lowest || candidate.limitC < lowest.limitC) lowest = candidate;
  return lowest;
}

/**
 * The limits that bring a caution (not a failure) in a step of this stage:
 * a substrate's continuous-use rating when a short-term limit is also known,
 * an amorphous substrate's glass transition (one without a melting point),
 * an organic phase's melting point in drying and curing, and the glass
 * transition of an organic phase known by nothing else, in curing.
 */
function softLimits(subject: ThermalSubject, stage: StepStage): NamedLimit[] {
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
function anyLimit(subject: ThermalSubject): NamedLimit | undefined {
  return hardLimit(subject, "air") ?? softLimits(subject, "curing")[0];
}

function show(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/** One step checked against one subject; `limit` is the subject's `anyLimit`. */
function checkStep(subject: ThermalSubject, limit: NamedLimit, step: ProcessStep, marginC: number): ThermalCheck {
  const stage = stageOf(step);
  const atmosphere = atmosphereOf(step);
  const t = step.temperatureC;
  const hard = hardLimit(subject, atmosphere);
  let status: ThermalStatus = "clear";
  let reference: NamedLimit | undefined = hard;
  if (hard && t >= hard.limitC) {
    status = "fail";
  } else if (hard && t >= hard.limitC - marginC) {
    status = "caution";
  } else {
    for (const soft of softLimits(subject, stage)) {
      if (t >= soft.limitC) {
        status = "caution";
        reference = soft;
        break;
      }
    }
  }
  // A row names the limit it was judged against; a material with soft limits only names the first of them.
  reference ??= softLimits(subject, stage)[0] ?? limit;
  return {
    materialId: subject.materialId,
    stepName: step.name,
    temperatureC: t,
    limit: reference.limit,
    limitC: reference.limitC,
    marginC,
    status,
    stage,
    atmosphere,
  };
}

/**
 * Thermal compatibility of the process steps (chemistry: "Thermal
 * compatibility"). For every organic phase and the substrate, per step:
 * fail at T ≥ H (the hard limit under the step's atmosphere, see
 * `hardLimit`); caution at T ≥ H − margin, and at the soft limits that apply
 * in the step's stage (a substrate's service rating when its short-term
 * limit is known, with the hours spent above it; an amorphous substrate's
 * Tg; an organic phase's Tm in drying and curing; the Tg of an organic phase
 * known by nothing else, in curing); clear otherwise. maxAllowedC is the
 * lowest H − margin (air limits unless every step is inert), with the
 * material and limit that bind it. A precursor's conversion temperature gets
 * one row on the hottest step: caution when no step reaches it.
 * Temperatures in °C, durations in h.
 *
 * @param subjects - organic phases and the substrate
 * @param conversions - precursors with a conversion temperature
 * @param steps - process steps
 * @param marginC - safety margin, °C
 * @returns the thermal result and its notices
 * @example
 * ```ts
 * const { thermal } = checkThermal([polycarbonate], [], [{ name: "cure", temperatureC: 135, durationH: 2 }], 20);
 * thermal.status; // "fail" when the heat deflection temperature is 132 °C
 * ```
 */
export function checkThermal(
  subjects: readonly ThermalSubject[],
  conversions: readonly ConversionSubject[],
  steps: readonly ProcessStep[],
  marginC: number,
): { thermal: ThermalResult; notices: Notice[] } {
  const checks: ThermalCheck[] = [];
  const notices: Notice[] = [];
  let maxAllowed: { value: number; materialId: string; limit: ThermalLimit } | undefined;
  const allInert = steps.length > 0 && steps.every((step) => atmosphereOf(step) === "inert");

  for (const subject of subjects) {
    const any = anyLimit(subject);
    if (!any) {
      notices.push({
        level: "info",
        code: "no_thermal_data",
        field: `${subject.path}.thermal`,
        message: `${subject.name} has no thermal limits; its compatibility with the process steps is not checked.`,
      });
      continue;
    }
    const hard = hardLimit(subject, allInert ? "inert" : "air");
    if (hard) {
      // whole degrees (the usual case) subtract exactly in floats; otherwise the decimal difference, rounded once
      const cautionFrom =
        Number.isSafeInteger(hard.limitC) && Number.isSafeInteger(marginC) ? hard.limitC - marginC : new Dec(hard.limitC).minus(marginC).toNumber();
      if (!maxAllowed || cautionFrom < maxAllowed.value) maxAllowed = { value: cautionFrom, materialId: subject.materialId, limit: hard.limit };
    }
    for (const step of steps) checks.push(checkStep(subject, any, step, marginC));

    const service = subject.role === "substrate" ? subject.thermal : undefined;
    if (service?.heatDeflectionC !== undefined && service.maxServiceC !== undefined) {
      const above = steps.filter((step) => step.temperatureC >= service.maxServiceC!);
      if (above.length > 0) {
        const hours = above.reduce((sum, step) => sum.plus(step.durationH), new Dec(0));
        notices.push({
          level: "caution",
          code: "above_service_rating",
          field: "steps",
          message:
            `${subject.name} spends ${show(hours.toNumber())} h at or above its continuous-use rating of ${show(service.maxServiceC)} °C ` +
            `(${above.map((step) => `"${step.name}" ${show(step.temperatureC)} °C`).join(", ")}): keep such steps short; ` +
            `its short-term limit is the heat deflection temperature, ${show(service.heatDeflectionC)} °C.`,
        });
      }
    }
  }

  if (conversions.length > 0) {
    let hottest: ProcessStep | undefined;
    for (const step of steps) if (!hottest || step.temperatureC > hottest.temperatureC) hottest = step;
    for (const precursor of conversions) {
      const reached = hottest !== undefined && hottest.temperatureC >= precursor.conversionTemperatureC;
      if (hottest) {
        checks.push({
          materialId: precursor.materialId,
          stepName: hottest.name,
          temperatureC: hottest.temperatureC,
          limit: "conversion",
          limitC: precursor.conversionTemperatureC,
          marginC,
          status: reached ? "clear" : "caution",
          stage: stageOf(hottest),
          atmosphere: atmosphereOf(hottest),
        });
      }
      if (!reached) {
        const conflict =
          maxAllowed !== undefined && precursor.conversionTemperatureC > maxAllowed.value
            ? ` It is also above the highest allowed step temperature (${show(maxAllowed.value)} °C).`
            : "";
        notices.push({
          level: "caution",
          code: "conversion_not_reached",
          field: "steps",
          message:
            `No process step reaches the conversion temperature of ${precursor.name} (${show(precursor.conversionTemperatureC)} °C): ` +
            `its residue will not be the stated ${precursor.residueFormula}.${conflict}`,
        });
      }
    }
  }

  let status: ThermalStatus = "clear";
  for (const check of checks) if (STATUS_RANK[check.status] > STATUS_RANK[status]) status = check.status;
  if (notices.some((notice) => notice.code === "conversion_not_reached") && status === "clear") status = "caution";

  if (steps.length === 0) {
    notices.push({
      level: "info",
      code: "no_process_steps",
      field: "steps",
      message: "No process steps yet: thermal compatibility is checked once steps are added.",
    });
  }
  const names = new Map(subjects.map((subject) => [subject.materialId, subject.name]));
  for (const level of ["fail", "caution"] as const) {
    const rows = checks.filter((check) => check.status === level && check.limit !== "conversion");
    if (rows.length === 0) continue;
    const detail = rows
      .map((row) => `"${row.stepName}" at ${show(row.temperatureC)} °C vs ${names.get(row.materialId) ?? row.materialId} ${LIMIT_LABELS[row.limit]} ${show(row.limitC)} °C`)
      .join("; ");
    notices.push({
      level: level === "fail" ? "error" : "caution",
      code: level === "fail" ? "thermal_limit_exceeded" : "thermal_limit_near",
      field: "steps",
      message:
        level === "fail"
          ? `Process steps at or above a hard thermal limit: ${detail}.`
          : `Process steps within the ${show(marginC)} °C margin of a limit, past a glass transition or melting point, or above a service rating: ${detail}.`,
    });
  }

  const thermal: ThermalResult = { status, checks };
  if (maxAllowed) {
    thermal.maxAllowedC = maxAllowed.value;
    thermal.binding = { materialId: maxAllowed.materialId, limit: maxAllowed.limit };
  }
  return { thermal, notices };
}
