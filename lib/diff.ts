/**
 * Differences between two revisions: their inputs and their key results,
 * as a flat list of paths with the value before and after.
 */
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import type { Specification } from "@/lib/quality/specification";

export interface DiffEntry {
  path: string;
  before: unknown;
  after: unknown;
}

type Flat = Record<string, unknown>;

function flatten(value: unknown, prefix: string, out: Flat): Flat {
  if (value === null || typeof value !== "object") {
    out[prefix] = value;
    return out;
  }
  if (Array.isArray(value)) {
    if (value.length === 0) out[prefix] = [];
    value.forEach((v, i) => flatten(v, `${prefix}[${i}]`, out));
    return out;
  }
  const entries = Object.entries(value as Record<string, unknown>);
  if (entries.length === 0) out[prefix] = {};
  for (const [k, v] of entries) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  return out;
}

/** Input fields keyed by material name rather than position, so reordering reads well. */
function inputView(input: FormulationInput): Record<string, unknown> {
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  const name = (id: string | undefined) => (id ? (names.get(id) ?? id) : undefined);
  return {
    basis: input.basis,
    components: Object.fromEntries(input.components.map((c) => [name(c.materialId)!, c.weightFraction])),
    modifiers: Object.fromEntries((input.modifiers ?? []).map((m) => [`${name(m.materialId)} on ${name(m.precursorId)}`, m.molPerMetal])),
    // Defaults written out, so a draft saved before the water conventions existed compares equal to one that states them.
    water: {
      materialId: name(input.water.materialId),
      ratio: input.water.ratio,
      value: input.water.value,
      referenceId: input.water.ratio === "perPrecursor" ? (name(input.water.referenceId) ?? null) : null,
      countCarried: input.water.countCarried ?? true,
    },
    solvent: input.solvent ? { ...input.solvent, materialId: name(input.solvent.materialId) } : null,
    catalyst: input.catalyst ? { ...input.catalyst, materialId: name(input.catalyst.materialId) } : null,
    substrate: name(input.substrateId) ?? null,
    steps: input.steps.map((st) => ({ ...st, stage: st.stage ?? "curing", atmosphere: st.atmosphere ?? "air" })),
    marginC: input.marginC ?? 20,
    measuredBulkDensity: input.measuredBulkDensity ?? null,
    // No coat reads as method "none", so a draft saved before the coat predictions compares equal to one without a coat,
    // and setting one shows "coating.method: none → dip".
    coating: input.coating ?? { method: "none" },
    materialProperties: Object.fromEntries(
      input.materials.map((m) => {
        const { id: _id, name: _name, sources: _s, ...props } = m;
        void _id; void _name; void _s;
        return [m.name, props];
      }),
    ),
  };
}

function resultView(result: FormulationResult | null, input: FormulationInput): Record<string, unknown> {
  if (!result) return { computed: false };
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  return {
    lines: Object.fromEntries(result.lines.map((l) => [names.get(l.materialId) ?? l.materialId, { massGrams: l.massGrams, volumeMl: l.volumeMl }])),
    waterToAddGrams: result.water.addGrams,
    effectiveR: result.water.effectiveR,
    effectiveH: result.water.effectiveH ?? null,
    modifiers: Object.fromEntries(
      (result.modifiers ?? []).map((m) => [`${names.get(m.materialId) ?? m.materialId} on ${names.get(m.precursorId) ?? m.precursorId}`, { bondedGrams: m.bondedGrams, removedInStep: m.removedInStep ?? null }]),
    ),
    solidsFraction: result.sol.solidsFraction,
    theoreticalDensity: result.composite.theoreticalDensity,
    thermalStatus: result.thermal.status,
    maxAllowedC: result.thermal.maxAllowedC ?? null,
    // The coat's predicted figures; absent (null) in results of engines before 2.1 and without a coat.
    coat: result.coating
      ? {
          wetThicknessUm: result.coating.wetThicknessUm,
          dryThicknessNm: result.coating.dryThicknessNm,
          coverageM2PerL: result.coating.coverageM2PerL,
          withdrawalMmPerSForTarget: result.coating.withdrawalMmPerSForTarget ?? null,
          rpmForTarget: result.coating.rpmForTarget ?? null,
          capillaryNumber: result.coating.capillaryNumber ?? null,
        }
      : null,
    refractiveIndex: result.optics?.refractiveIndex ?? null,
    indexMismatch: result.optics?.mismatch ?? null,
    vocGramsPerLitre: result.voc?.gramsPerLitre ?? null,
    vocGramsPerLitreLessWater: result.voc?.gramsPerLitreLessWater ?? null,
    epoxyAmineRatio: result.cure?.ratio ?? null,
    costPerBatch: result.cost?.total ?? null,
  };
}

function diffFlat(a: Flat, b: Flat, prefix: string): DiffEntry[] {
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  const out: DiffEntry[] = [];
  for (const k of keys) {
    if (JSON.stringify(a[k]) !== JSON.stringify(b[k])) out.push({ path: `${prefix}${k}`, before: a[k] ?? null, after: b[k] ?? null });
  }
  return out;
}

/** Specifications keyed by property (ids and origin left out), so a copied and edited list reads by what changed. */
function specificationsView(specs: Specification[] | null | undefined): Record<string, unknown> {
  return Object.fromEntries(
    (specs ?? []).map((s) => [
      s.property,
      s.numeric
        ? { method: s.method, unit: s.unit, target: s.target, lower: s.lower, upper: s.upper }
        : { method: s.method, requirement: s.requirement },
    ]),
  );
}

type Side = { input: FormulationInput; result: FormulationResult | null; specifications?: Specification[] | null };

/** Everything that differs between revision A (before) and B (after): inputs, key results and test specifications. */
export function diffRevisions(a: Side, b: Side): { input: DiffEntry[]; results: DiffEntry[]; specifications: DiffEntry[] } {
  return {
    input: diffFlat(flatten(inputView(a.input), "", {}), flatten(inputView(b.input), "", {}), ""),
    results: diffFlat(flatten(resultView(a.result, a.input), "", {}), flatten(resultView(b.result, b.input), "", {}), ""),
    specifications: diffFlat(flatten(specificationsView(a.specifications), "", {}), flatten(specificationsView(b.specifications), "", {}), ""),
  };
}
