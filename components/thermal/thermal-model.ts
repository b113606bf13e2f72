import { ATMOSPHERE_LABELS, STAGE_LABELS } from "@/components/results/words";
import { hardLimit, type FormulationInput, type FormulationResult, type ThermalCheck, type ThermalStatus } from "@/lib/formulation";

export interface ThermalRow {
  materialId: string;
  name: string;
  role: "organic" | "substrate";
  /** One check per process step, in step order (undefined when the material has no limits). */
  cells: (ThermalCheck | undefined)[];
  hard?: { limit: string; limitC: number };
  /** The hard limit under inert gas, when it differs from the one in air. */
  hardInert?: { limit: string; limitC: number };
  worst: ThermalStatus;
}

const RANK: Record<ThermalStatus, number> = { clear: 0, caution: 1, fail: 2 };

/** The materials × process steps matrix of a result. */
export function thermalRows(input: FormulationInput, result: FormulationResult): ThermalRow[] {
  const byId = new Map(input.materials.map((m) => [m.id, m]));
  const subjects: { id: string; role: "organic" | "substrate" }[] = [];
  for (const c of input.components) {
    const m = byId.get(c.materialId);
    if (m?.kind === "organic" && c.weightFraction > 0 && !subjects.some((s) => s.id === m.id)) subjects.push({ id: m.id, role: "organic" });
  }
  if (input.substrateId) subjects.push({ id: input.substrateId, role: "substrate" });
  return subjects.map(({ id, role }) => {
    const m = byId.get(id);
    const checks = result.thermal.checks.filter((c) => c.materialId === id && c.limit !== "conversion");
    const cells = input.steps.map((_, i) => checks[i]);
    const subject = m ? { materialId: id, name: m.name, role, thermal: m.thermal, path: "" } : undefined;
    const hard = subject ? hardLimit(subject) : undefined;
    const inert = subject ? hardLimit(subject, "inert") : undefined;
    const hardInert = inert && (inert.limit !== hard?.limit || inert.limitC !== hard?.limitC) ? inert : undefined;
    let worst: ThermalStatus = "clear";
    for (const c of checks) if (RANK[c.status] > RANK[worst]) worst = c.status;
    return { materialId: id, name: m?.name ?? id, role, cells, hard, ...(hardInert ? { hardInert } : {}), worst };
  });
}

/** Conversion checks of precursors that need heat. */
export function conversionChecks(result: FormulationResult): ThermalCheck[] {
  return result.thermal.checks.filter((c) => c.limit === "conversion");
}

/** A step's stage and atmosphere in words; a step that does not say is a cure in air, as the engine checks it. */
export function stepConditions(step: { stage?: "sol" | "drying" | "curing"; atmosphere?: "air" | "inert" }): string {
  return `${STAGE_LABELS[step.stage ?? "curing"]} · ${ATMOSPHERE_LABELS[step.atmosphere ?? "air"]}`;
}

/** Thermal notices to show beside the matrix: the hours above a substrate's service rating. */
export function serviceNotices(result: FormulationResult): FormulationResult["notices"] {
  return result.notices.filter((n) => n.code === "above_service_rating");
}
