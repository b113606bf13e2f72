import { hardLimit, type FormulationInput, type FormulationResult, type ThermalCheck, type ThermalStatus } from "@/lib/formulation";

export interface ThermalRow {
  materialId: string;
  name: string;
  role: "organic" | "substrate";
  /** One check per process step, in step order (undefined when the material has no limits). */
  cells: (ThermalCheck | undefined)[];
  hard?: { limit: string; limitC: number };
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
    const hard = m ? hardLimit({ materialId: id, name: m.name, role, thermal: m.thermal, path: "" }) : undefined;
    let worst: ThermalStatus = "clear";
    for (const c of checks) if (RANK[c.status] > RANK[worst]) worst = c.status;
    return { materialId: id, name: m?.name ?? id, role, cells, hard, worst };
  });
}

/** Conversion checks of precursors that need heat. */
export function conversionChecks(result: FormulationResult): ThermalCheck[] {
  return result.thermal.checks.filter((c) => c.limit === "conversion");
}
