import { Dec } from "./decimal";
import type { ProcessStep } from "./input-schema";
import type { Notice, ThermalCheck, ThermalLimit, ThermalResult, ThermalStatus } from "./result-types";
import {
  anyLimit,
  atmosphereOf,
  hardLimit,
  LIMIT_LABELS,
  softLimits,
  stageOf,
  STATUS_RANK,
  type ConversionSubject,
  type NamedLimit,
  type ThermalSubject,
} from "./thermal-limits";

// the limits stay importable from here, beside the checks that use them
export {
  atmosphereOf,
  hardLimit,
  LIMIT_LABELS,
  stageOf,
  type ConversionSubject,
  type NamedLimit,
  type StepAtmosphere,
  type StepStage,
  type ThermalSubject,
} from "./thermal-limits";

/** Integers below this magnitude print the same with and without rounding to 6 significant digits. */
const EXACT_AT_6_DIGITS = 1e6;

/**
 * A temperature (°C) or duration (h) as the thermal messages print it:
 * rounded to 6 significant digits, without trailing zeros. An integer of
 * fewer than 7 digits is printed as it is (the rounding leaves it unchanged).
 *
 * @example
 * ```ts
 * showValue(132); // "132"
 * showValue(2 / 3); // "0.666667"
 * ```
 */
export function showValue(value: number): string {
  if (Number.isInteger(value) && value < EXACT_AT_6_DIGITS && value > -EXACT_AT_6_DIGITS) return String(value);
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
    const soft = softLimits(subject, stage);
    for (const candidate of soft) {
      if (t >= candidate.limitC) {
        status = "caution";
        reference = candidate;
        break;
      }
    }
    // A row names the limit it was judged against; a material with soft limits only names the first of them.
    reference ??= soft[0];
  }
  reference ??= limit;
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

/** The row statuses that get a notice, worst first. */
const LEVELS_REPORTED = ["fail", "caution"] as const;

/** The name a row shows for its material: of the last subject with that id (as a Map built from the subjects keeps), else the id. */
function subjectName(subjects: readonly ThermalSubject[], materialId: string): string {
  for (let i = subjects.length - 1; i >= 0; i -= 1) if (subjects[i]!.materialId === materialId) return subjects[i]!.name;
  return materialId;
}

/** The rows of one status (conversion rows aside) as "; "-separated text, or undefined when there are none. */
function rowDetails(checks: readonly ThermalCheck[], level: ThermalStatus, subjects: readonly ThermalSubject[]): string | undefined {
  let detail: string | undefined;
  for (const row of checks) {
    if (row.status !== level || row.limit === "conversion") continue;
    const text = `"${row.stepName}" at ${showValue(row.temperatureC)} °C vs ${subjectName(subjects, row.materialId)} ${LIMIT_LABELS[row.limit]} ${showValue(row.limitC)} °C`;
    detail = detail === undefined ? text : `${detail}; ${text}`;
  }
  return detail;
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
            `${subject.name} spends ${showValue(hours.toNumber())} h at or above its continuous-use rating of ${showValue(service.maxServiceC)} °C ` +
            `(${above.map((step) => `"${step.name}" ${showValue(step.temperatureC)} °C`).join(", ")}): keep such steps short; ` +
            `its short-term limit is the heat deflection temperature, ${showValue(service.heatDeflectionC)} °C.`,
        });
      }
    }
  }

  let conversionMissed = false;
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
        conversionMissed = true;
        const conflict =
          maxAllowed !== undefined && precursor.conversionTemperatureC > maxAllowed.value
            ? ` It is also above the highest allowed step temperature (${showValue(maxAllowed.value)} °C).`
            : "";
        notices.push({
          level: "caution",
          code: "conversion_not_reached",
          field: "steps",
          message:
            `No process step reaches the conversion temperature of ${precursor.name} (${showValue(precursor.conversionTemperatureC)} °C): ` +
            `its residue will not be the stated ${precursor.residueFormula}.${conflict}`,
        });
      }
    }
  }

  let status: ThermalStatus = "clear";
  for (const check of checks) if (STATUS_RANK[check.status] > STATUS_RANK[status]) status = check.status;
  if (conversionMissed && status === "clear") status = "caution";

  if (steps.length === 0) {
    notices.push({
      level: "info",
      code: "no_process_steps",
      field: "steps",
      message: "No process steps yet: thermal compatibility is checked once steps are added.",
    });
  }
  for (const level of LEVELS_REPORTED) {
    const detail = rowDetails(checks, level, subjects);
    if (detail === undefined) continue;
    notices.push({
      level: level === "fail" ? "error" : "caution",
      code: level === "fail" ? "thermal_limit_exceeded" : "thermal_limit_near",
      field: "steps",
      message:
        level === "fail"
          ? `Process steps at or above a hard thermal limit: ${detail}.`
          : `Process steps within the ${showValue(marginC)} °C margin of a limit, past a glass transition or melting point, or above a service rating: ${detail}.`,
    });
  }

  const thermal: ThermalResult = { status, checks };
  if (maxAllowed) {
    thermal.maxAllowedC = maxAllowed.value;
    thermal.binding = { materialId: maxAllowed.materialId, limit: maxAllowed.limit };
  }
  return { thermal, notices };
}
