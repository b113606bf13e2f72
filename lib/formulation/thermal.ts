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

const STATUS_RANK: Record<ThermalStatus, number> = { clear: 0, caution: 1, fail: 2 };

const LIMIT_WORDS: Record<ThermalLimit, string> = {
  degradationOnset: "degradation onset",
  maxService: "maximum service temperature",
  melting: "melting point",
  glassTransition: "glass transition",
  conversion: "conversion temperature",
};

/**
 * Hard limit H, °C: the lowest of the degradation onset and the grade
 * maximum, and for a substrate also the melting point (the part must keep
 * its shape). Undefined when none is known.
 *
 * @example
 * ```ts
 * hardLimit({ materialId: "pc", name: "PC", role: "substrate", path: "materials.0",
 *   thermal: { glassTransitionC: 147, degradationOnsetC: 450, maxServiceC: 125 } });
 * // { limit: "maxService", limitC: 125 }
 * ```
 */
export function hardLimit(subject: ThermalSubject): NamedLimit | undefined {
  const t = subject.thermal;
  if (!t) return undefined;
  const candidates: NamedLimit[] = [];
  if (t.degradationOnsetC !== undefined) candidates.push({ limit: "degradationOnset", limitC: t.degradationOnsetC });
  if (t.maxServiceC !== undefined) candidates.push({ limit: "maxService", limitC: t.maxServiceC });
  if (subject.role === "substrate" && t.meltingC !== undefined) candidates.push({ limit: "melting", limitC: t.meltingC });
  let lowest: NamedLimit | undefined;
  for (const candidate of candidates) if (!lowest || candidate.limitC < lowest.limitC) lowest = candidate;
  return lowest;
}

/** The softening or melting limit that brings a caution: Tg of a substrate, Tm of an organic phase. */
function softLimit(subject: ThermalSubject): NamedLimit | undefined {
  const t = subject.thermal;
  if (subject.role === "substrate" && t?.glassTransitionC !== undefined) {
    return { limit: "glassTransition", limitC: t.glassTransitionC };
  }
  if (subject.role === "organic" && t?.meltingC !== undefined) return { limit: "melting", limitC: t.meltingC };
  return undefined;
}

function show(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/**
 * Thermal compatibility of the process steps (chemistry: "Thermal
 * compatibility"). For every organic phase and the substrate, per step:
 * fail at T ≥ H; caution at T ≥ H − margin, at T ≥ Tg of a substrate, at
 * T ≥ Tm of an organic phase; clear otherwise. maxAllowedC is the lowest
 * H − margin, with the material and limit that bind it. A precursor's
 * conversion temperature gets one row on the hottest step: caution when no
 * step reaches it. Temperatures in °C.
 *
 * @param subjects - organic phases and the substrate
 * @param conversions - precursors with a conversion temperature
 * @param steps - process steps
 * @param marginC - safety margin, °C
 * @returns the thermal result and its notices
 * @example
 * ```ts
 * const { thermal } = checkThermal([polycarbonate], [], [{ name: "cure", temperatureC: 130, durationH: 2 }], 20);
 * thermal.status; // "fail" when the grade maximum is 125 °C
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

  for (const subject of subjects) {
    const hard = hardLimit(subject);
    const soft = softLimit(subject);
    if (!hard && !soft) {
      notices.push({
        level: "info",
        code: "no_thermal_data",
        field: `${subject.path}.thermal`,
        message: `${subject.name} has no thermal limits; its compatibility with the process steps is not checked.`,
      });
      continue;
    }
    const cautionFrom = hard ? new Dec(hard.limitC).minus(marginC).toNumber() : undefined;
    if (hard && cautionFrom !== undefined && (!maxAllowed || cautionFrom < maxAllowed.value)) {
      maxAllowed = { value: cautionFrom, materialId: subject.materialId, limit: hard.limit };
    }
    for (const step of steps) {
      const t = step.temperatureC;
      let status: ThermalStatus = "clear";
      let reference = (hard ?? soft) as NamedLimit;
      if (hard && t >= hard.limitC) {
        status = "fail";
      } else if (hard && cautionFrom !== undefined && t >= cautionFrom) {
        status = "caution";
      } else if (soft && t >= soft.limitC) {
        status = "caution";
        reference = soft;
      }
      checks.push({
        materialId: subject.materialId,
        stepName: step.name,
        temperatureC: t,
        limit: reference.limit,
        limitC: reference.limitC,
        marginC,
        status,
      });
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
  for (const level of ["fail", "caution"] as const) {
    const rows = checks.filter((check) => check.status === level && check.limit !== "conversion");
    if (rows.length === 0) continue;
    const names = new Map(subjects.map((subject) => [subject.materialId, subject.name]));
    const detail = rows
      .map((row) => `"${row.stepName}" at ${show(row.temperatureC)} °C vs ${names.get(row.materialId) ?? row.materialId} ${LIMIT_WORDS[row.limit]} ${show(row.limitC)} °C`)
      .join("; ");
    notices.push({
      level: level === "fail" ? "error" : "caution",
      code: level === "fail" ? "thermal_limit_exceeded" : "thermal_limit_near",
      field: "steps",
      message:
        level === "fail"
          ? `Process steps at or above a hard thermal limit: ${detail}.`
          : `Process steps within the ${show(marginC)} °C margin of a limit, or past a glass transition or melting point: ${detail}.`,
    });
  }

  const thermal: ThermalResult = { status, checks };
  if (maxAllowed) {
    thermal.maxAllowedC = maxAllowed.value;
    thermal.binding = { materialId: maxAllowed.materialId, limit: maxAllowed.limit };
  }
  return { thermal, notices };
}
