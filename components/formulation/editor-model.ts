/**
 * The editor's form values and their conversion to and from the engine's
 * FormulationInput. Percentages in the form (wt%, solids content, linear
 * shrinkage) are fractions in the engine; conversion is exact to 12 digits.
 */
import { z } from "zod";
import { ALL_FIELDS } from "@/components/materials/material-fields";
import type { CoatingSpec, FormulationInput, Material, MaterialKind } from "@/lib/formulation";
import { STEP_ATMOSPHERES, STEP_STAGES, WATER_RATIOS } from "@/lib/formulation/input-schema";

export type BasisType = "solidMass" | "solidsContent" | "gelBody";
export type SolventMode = "none" | "molPerNetworkAtom" | "fill";
export type StepStage = (typeof STEP_STAGES)[number];
export type StepAtmosphere = (typeof STEP_ATMOSPHERES)[number];
export type WaterRatio = (typeof WATER_RATIOS)[number];
export type CoatMethod = "none" | CoatingSpec["method"];

/**
 * The coat as the form holds it: every method's inputs are kept while the
 * method changes (switching back restores them); only the chosen method's go
 * to the engine. Optional figures are NaN when empty.
 */
export interface CoatValues {
  method: CoatMethod;
  /** Dip: mm/s, mPa·s, mN/m. */
  withdrawalMmPerS: number;
  viscosityMPaS: number;
  surfaceTensionMNPerM: number;
  /** Spin: rpm, and one measured film (rpm, dry nm). */
  rpm: number;
  calibrationRpm: number;
  calibrationDryThicknessNm: number;
  /** Wet film: µm. */
  wetThicknessUm: number;
  /** nm; NaN when no target. */
  targetDryThicknessNm: number;
  /** m²; NaN when no area. */
  areaM2: number;
}

/** A new coat: dip at 1 mm/s in an alcoholic sol (≈ 2.5 mPa·s, ≈ 23 mN/m, ethanol-like; from memory). */
export const BLANK_COAT: CoatValues = {
  method: "none",
  withdrawalMmPerS: 1,
  viscosityMPaS: 2.5,
  surfaceTensionMNPerM: 23,
  rpm: 2000,
  calibrationRpm: 2000,
  calibrationDryThicknessNm: 500,
  wetThicknessUm: 10,
  targetDryThicknessNm: Number.NaN,
  areaM2: Number.NaN,
};

/** The form's coat field each coating input path belongs to. */
const COAT_FIELDS: Record<string, keyof CoatValues> = {
  method: "method",
  withdrawalMmPerS: "withdrawalMmPerS",
  viscosityMPaS: "viscosityMPaS",
  surfaceTensionMNPerM: "surfaceTensionMNPerM",
  rpm: "rpm",
  "calibration.rpm": "calibrationRpm",
  "calibration.dryThicknessNm": "calibrationDryThicknessNm",
  calibration: "calibrationRpm",
  wetThicknessUm: "wetThicknessUm",
  targetDryThicknessNm: "targetDryThicknessNm",
  areaM2: "areaM2",
};

/** The inputs each method needs (the others are kept but not sent). */
export const COAT_REQUIRED: Record<CoatMethod, (keyof CoatValues)[]> = {
  none: [],
  dip: ["withdrawalMmPerS", "viscosityMPaS", "surfaceTensionMNPerM"],
  spin: ["rpm", "calibrationRpm", "calibrationDryThicknessNm"],
  wetFilm: ["wetThicknessUm"],
};

export interface EditorValues {
  name: string;
  project: string;
  description: string;
  basis: {
    type: BasisType;
    grams: number;
    solMassGrams: number;
    solidsPercent: number;
    volumeMl: number;
    bulkDensity: number;
    linearShrinkagePercent: number;
  };
  components: { materialId: string; weightPercent: number }[];
  /** Chelating or exchanging ligands: mol modifier per mol metal of one precursor. */
  modifiers: { materialId: string; precursorId: string; molPerMetal: number }[];
  water: { materialId: string; ratio: WaterRatio; value: number; referenceId: string; countCarried: boolean };
  solvent: { mode: SolventMode; materialId: string; value: number };
  catalyst: { materialId: string; molPerNetworkAtom: number };
  substrateId: string;
  steps: { name: string; temperatureC: number; durationH: number; stage: StepStage; atmosphere: StepAtmosphere }[];
  marginC: number;
  /** The saved order of addition, kept as it was (the editor does not change it). */
  additionOrder?: string[];
  /** g/cm³; NaN when not measured. */
  measuredBulkDensity: number;
  /** How the coat is applied (method "none": no film predictions). */
  coating: CoatValues;
}

const num = (what: string) => z.number({ error: `Enter a number for the ${what}` });

/**
 * Form-level checks (react-hook-form resolver): text that must be there and
 * numbers that must be numbers. Chemistry checks come from the engine.
 */
export const editorSchema = z.object({
  name: z.string().trim().min(1, "Name the formulation").max(200, "At most 200 characters"),
  project: z.string().max(200, "At most 200 characters"),
  description: z.string().max(5000, "At most 5000 characters"),
  basis: z.object({
    type: z.enum(["solidMass", "solidsContent", "gelBody"]),
    grams: z.number(),
    solMassGrams: z.number(),
    solidsPercent: z.number(),
    volumeMl: z.number(),
    bulkDensity: z.number(),
    linearShrinkagePercent: z.number(),
  }),
  components: z.array(
    z.object({
      materialId: z.string().min(1, "choose a material"),
      weightPercent: num("weight fraction"),
    }),
  ),
  modifiers: z.array(
    z.object({
      materialId: z.string().min(1, "choose a modifier"),
      precursorId: z.string().min(1, "choose the precursor it modifies"),
      molPerMetal: num("modifier ratio"),
    }),
  ),
  water: z.object({
    materialId: z.string().min(1, "Pick the water"),
    ratio: z.enum(WATER_RATIOS),
    value: num("water ratio"),
    referenceId: z.string(),
    countCarried: z.boolean(),
  }),
  solvent: z.object({ mode: z.enum(["none", "molPerNetworkAtom", "fill"]), materialId: z.string(), value: z.number() }),
  catalyst: z.object({ materialId: z.string(), molPerNetworkAtom: z.number() }),
  substrateId: z.string(),
  steps: z.array(
    z.object({
      name: z.string().trim().min(1, "Name the step"),
      temperatureC: num("temperature"),
      durationH: num("duration"),
      stage: z.enum(STEP_STAGES),
      atmosphere: z.enum(STEP_ATMOSPHERES),
    }),
  ),
  marginC: num("margin"),
  measuredBulkDensity: z.number().or(z.nan()),
  additionOrder: z.array(z.string()).optional(),
  coating: z
    .object({
      method: z.enum(["none", "dip", "spin", "wetFilm"]),
      withdrawalMmPerS: z.number().or(z.nan()),
      viscosityMPaS: z.number().or(z.nan()),
      surfaceTensionMNPerM: z.number().or(z.nan()),
      rpm: z.number().or(z.nan()),
      calibrationRpm: z.number().or(z.nan()),
      calibrationDryThicknessNm: z.number().or(z.nan()),
      wetThicknessUm: z.number().or(z.nan()),
      targetDryThicknessNm: z.number().or(z.nan()),
      areaM2: z.number().or(z.nan()),
    })
    .superRefine((c, ctx) => {
      // The chosen method's inputs must be numbers; the engine checks their ranges.
      for (const key of COAT_REQUIRED[c.method]) {
        if (!Number.isFinite(c[key] as number)) ctx.addIssue({ code: "custom", path: [key], message: "Enter a number" });
      }
    }),
});

const clean = (x: number) => (Number.isFinite(x) ? Number(x.toPrecision(12)) : x);
const pct = (fraction: number | undefined, fallback: number) => (fraction === undefined ? fallback : clean(fraction * 100));

/** A material record as the engine wants it: no library-only fields. */
export function engineMaterial(record: Material & { updatedAt?: unknown; casNumber?: unknown }): Material {
  const { updatedAt: _u, casNumber: _c, ...rest } = record;
  void _u;
  void _c;
  return rest as Material;
}

/** Defaults for a new formulation, from the team's library. */
export function blankValues(library: Material[]): EditorValues {
  const first = (kind: MaterialKind, prefer?: RegExp) =>
    library.find((m) => m.kind === kind && (!prefer || prefer.test(m.name)))?.id ?? library.find((m) => m.kind === kind)?.id ?? "";
  return {
    name: "",
    project: "",
    description: "",
    basis: { type: "solidMass", grams: 10, solMassGrams: 100, solidsPercent: 20, volumeMl: 50, bulkDensity: 0.5, linearShrinkagePercent: 0 },
    components: [{ materialId: "", weightPercent: 100 }],
    modifiers: [],
    water: { materialId: first("water"), ratio: "R", value: 4, referenceId: "", countCarried: true },
    solvent: { mode: "molPerNetworkAtom", materialId: first("solvent", /^ethanol/i), value: 4 },
    catalyst: { materialId: first("catalyst", /hydrochloric/i), molPerNetworkAtom: 0.01 },
    substrateId: "",
    steps: [
      { name: "Hydrolysis, stirred", temperatureC: 25, durationH: 2, stage: "sol", atmosphere: "air" },
      { name: "Drying", temperatureC: 60, durationH: 24, stage: "drying", atmosphere: "air" },
    ],
    marginC: 20,
    measuredBulkDensity: Number.NaN,
    coating: { ...BLANK_COAT },
  };
}

/** Form values of a stored coat (absent: method "none" with the blank inputs). */
function coatFromInput(spec: CoatingSpec | undefined): CoatValues {
  if (!spec) return { ...BLANK_COAT };
  const common = {
    targetDryThicknessNm: spec.targetDryThicknessNm ?? Number.NaN,
    areaM2: spec.areaM2 ?? Number.NaN,
  };
  if (spec.method === "dip") {
    const { withdrawalMmPerS, viscosityMPaS, surfaceTensionMNPerM } = spec;
    return { ...BLANK_COAT, method: "dip", withdrawalMmPerS, viscosityMPaS, surfaceTensionMNPerM, ...common };
  }
  if (spec.method === "spin") {
    return {
      ...BLANK_COAT,
      method: "spin",
      rpm: spec.rpm,
      calibrationRpm: spec.calibration.rpm,
      calibrationDryThicknessNm: spec.calibration.dryThicknessNm,
      ...common,
    };
  }
  return { ...BLANK_COAT, method: "wetFilm", wetThicknessUm: spec.wetThicknessUm, ...common };
}

/** The engine's coating input for the form's coat; undefined for method "none". */
export function coatingFromValues(c: CoatValues | undefined): CoatingSpec | undefined {
  if (!c || c.method === "none") return undefined;
  const targets = {
    ...(Number.isFinite(c.targetDryThicknessNm) ? { targetDryThicknessNm: c.targetDryThicknessNm } : {}),
    ...(Number.isFinite(c.areaM2) ? { areaM2: c.areaM2 } : {}),
  };
  if (c.method === "dip") {
    return {
      method: "dip",
      withdrawalMmPerS: c.withdrawalMmPerS,
      viscosityMPaS: c.viscosityMPaS,
      surfaceTensionMNPerM: c.surfaceTensionMNPerM,
      ...targets,
    };
  }
  if (c.method === "spin") {
    return { method: "spin", rpm: c.rpm, calibration: { rpm: c.calibrationRpm, dryThicknessNm: c.calibrationDryThicknessNm }, ...targets };
  }
  return { method: "wetFilm", wetThicknessUm: c.wetThicknessUm, ...targets };
}

/** Form values from a saved input. */
export function valuesFromInput(input: FormulationInput, meta: { name: string; project: string | null; description?: string | null }): EditorValues {
  const b = input.basis;
  return {
    name: meta.name,
    project: meta.project ?? "",
    description: meta.description ?? "",
    basis: {
      type: b.type,
      grams: b.type === "solidMass" ? b.grams : 10,
      solMassGrams: b.type === "solidsContent" ? b.solMassGrams : 100,
      solidsPercent: b.type === "solidsContent" ? pct(b.solidsFraction, 20) : 20,
      volumeMl: b.type === "gelBody" ? b.volumeMl : 50,
      bulkDensity: b.type === "gelBody" ? b.bulkDensity : 0.5,
      linearShrinkagePercent: b.type === "gelBody" ? pct(b.linearShrinkage, 0) : 0,
    },
    components: input.components.map((c) => ({ materialId: c.materialId, weightPercent: pct(c.weightFraction, 0) })),
    modifiers: (input.modifiers ?? []).map((m) => ({ materialId: m.materialId, precursorId: m.precursorId, molPerMetal: m.molPerMetal })),
    water: {
      materialId: input.water.materialId,
      ratio: input.water.ratio,
      value: input.water.value,
      referenceId: input.water.referenceId ?? "",
      countCarried: input.water.countCarried ?? true,
    },
    solvent: input.solvent
      ? { mode: input.solvent.mode, materialId: input.solvent.materialId, value: input.solvent.mode === "molPerNetworkAtom" ? input.solvent.value : 4 }
      : { mode: "none", materialId: "", value: 4 },
    catalyst: input.catalyst ? { ...input.catalyst } : { materialId: "", molPerNetworkAtom: 0.01 },
    substrateId: input.substrateId ?? "",
    // A stored step without a stage was checked as a cure; it stays one.
    steps: input.steps.map((s) => ({ ...s, stage: s.stage ?? "curing", atmosphere: s.atmosphere ?? "air" })),
    marginC: input.marginC ?? 20,
    measuredBulkDensity: input.measuredBulkDensity ?? Number.NaN,
    coating: coatFromInput(input.coating),
    ...(input.additionOrder ? { additionOrder: [...input.additionOrder] } : {}),
  };
}

/** Material ids the values refer to, in a stable order. */
function referencedIds(v: EditorValues): string[] {
  const ids = [
    ...v.components.map((c) => c.materialId),
    ...(v.modifiers ?? []).map((m) => m.materialId),
    v.water.materialId,
    v.solvent.mode !== "none" ? v.solvent.materialId : "",
    v.catalyst.materialId,
    v.substrateId,
  ].filter(Boolean);
  return [...new Set(ids)];
}

/**
 * The engine input for the form values; `records` resolves ids to material
 * records (the revision's own copies first, then the library).
 */
export function inputFromValues(v: EditorValues, records: (id: string) => Material | undefined): FormulationInput {
  const materials = referencedIds(v)
    .map((id) => records(id))
    .filter((m): m is Material => m !== undefined);
  const basis: FormulationInput["basis"] =
    v.basis.type === "solidMass"
      ? { type: "solidMass", grams: v.basis.grams }
      : v.basis.type === "solidsContent"
        ? { type: "solidsContent", solMassGrams: v.basis.solMassGrams, solidsFraction: clean(v.basis.solidsPercent / 100) }
        : {
            type: "gelBody",
            volumeMl: v.basis.volumeMl,
            bulkDensity: v.basis.bulkDensity,
            linearShrinkage: clean(v.basis.linearShrinkagePercent / 100),
          };
  const input: FormulationInput = {
    materials,
    basis,
    components: v.components.map((c) => ({ materialId: c.materialId, weightFraction: clean(c.weightPercent / 100) })),
    water: {
      materialId: v.water.materialId,
      ratio: v.water.ratio,
      value: v.water.value,
      ...(v.water.ratio === "perPrecursor" && v.water.referenceId ? { referenceId: v.water.referenceId } : {}),
      ...(v.water.countCarried === false ? { countCarried: false } : {}),
    },
    steps: v.steps.map((s) => ({
      name: s.name,
      temperatureC: s.temperatureC,
      durationH: s.durationH,
      stage: s.stage ?? "curing",
      atmosphere: s.atmosphere ?? "air",
    })),
    marginC: v.marginC,
  };
  const modifiers = v.modifiers ?? [];
  if (modifiers.length > 0) {
    input.modifiers = modifiers.map((m) => ({ materialId: m.materialId, precursorId: m.precursorId, molPerMetal: m.molPerMetal }));
  }
  if (v.solvent.mode === "molPerNetworkAtom") input.solvent = { materialId: v.solvent.materialId, mode: "molPerNetworkAtom", value: v.solvent.value };
  if (v.solvent.mode === "fill") input.solvent = { materialId: v.solvent.materialId, mode: "fill" };
  if (v.catalyst.materialId) input.catalyst = { materialId: v.catalyst.materialId, molPerNetworkAtom: v.catalyst.molPerNetworkAtom };
  if (v.substrateId) input.substrateId = v.substrateId;
  if (Number.isFinite(v.measuredBulkDensity)) input.measuredBulkDensity = v.measuredBulkDensity;
  if (v.additionOrder?.length) input.additionOrder = [...v.additionOrder];
  const coating = coatingFromValues(v.coating);
  if (coating) input.coating = coating;
  return input;
}

/** The material form's words for a property path ("precursor.leavingAlcohol.name" → "Alcohol released"). */
function propertyLabel(path: string): string {
  const exact = ALL_FIELDS.find((f) => f.path === path || path.startsWith(`${f.path}.`));
  if (exact) return exact.label.toLowerCase();
  const within = ALL_FIELDS.find((f) => f.path.startsWith(`${path}.`));
  return within ? within.label.toLowerCase() : "a property";
}

/** Where an engine or server message about `path` (of FormulationInput) belongs in the form. */
export function formFieldFor(path: string, v: EditorValues, input: FormulationInput): { field: string; prefix?: string } {
  const parts = path.split(".");
  const head = parts[0] ?? "";
  if (head === "components" && parts.length >= 3 && parts[2] === "weightFraction") return { field: `components.${parts[1]}.weightPercent` };
  if (head === "components" && parts.length >= 2) return { field: parts.length >= 3 ? `components.${parts[1]}.materialId` : "components" };
  if (head === "components") return { field: "components" };
  if (head === "basis") {
    const key = parts[1];
    if (key === "solidsFraction") return { field: "basis.solidsPercent" };
    if (key === "linearShrinkage") return { field: "basis.linearShrinkagePercent" };
    if (key && ["grams", "solMassGrams", "volumeMl", "bulkDensity"].includes(key)) return { field: `basis.${key}` };
    return { field: "basis.type" };
  }
  if (head === "modifiers") {
    const key = parts[2];
    if (parts.length >= 3 && key && ["materialId", "precursorId", "molPerMetal"].includes(key)) return { field: `modifiers.${parts[1]}.${key}` };
    return { field: parts.length >= 2 ? `modifiers.${parts[1]}.materialId` : "modifiers" };
  }
  if (head === "water" || head === "solvent" || head === "catalyst") {
    const key = parts[1];
    if (head === "water" && key === "referenceId") return { field: "water.referenceId" };
    if (head === "catalyst" && key === "molPerNetworkAtom") return { field: "catalyst.molPerNetworkAtom" };
    if (key && ["materialId", "ratio", "value", "mode"].includes(key)) return { field: `${head}.${key}` };
    return { field: `${head}.materialId` };
  }
  if (head === "substrateId") return { field: "substrateId" };
  if (head === "steps") return { field: parts.length >= 3 ? `steps.${parts[1]}.${parts[2]}` : "steps" };
  if (head === "marginC" || head === "measuredBulkDensity") return { field: head };
  if (head === "coating") {
    const rest = parts.slice(1).join(".");
    const key = COAT_FIELDS[rest] ?? COAT_FIELDS[parts[1] ?? ""] ?? "method";
    return { field: `coating.${key}` };
  }
  if (head === "materials" && parts[1] !== undefined) {
    const material = input.materials[Number(parts[1])];
    if (material) {
      const property = parts.length > 2 ? propertyLabel(parts.slice(2).join(".")) : null;
      const prefix = `${material.name} (library record${property ? `, ${property}` : ""}): `;
      const ci = v.components.findIndex((c) => c.materialId === material.id);
      if (ci >= 0) return { field: `components.${ci}.materialId`, prefix };
      const mi = (v.modifiers ?? []).findIndex((m) => m.materialId === material.id);
      if (mi >= 0) return { field: `modifiers.${mi}.materialId`, prefix };
      if (v.water.materialId === material.id) return { field: "water.materialId", prefix };
      if (v.solvent.materialId === material.id) return { field: "solvent.materialId", prefix };
      if (v.catalyst.materialId === material.id) return { field: "catalyst.materialId", prefix };
      if (v.substrateId === material.id) return { field: "substrateId", prefix };
      return { field: "general", prefix };
    }
  }
  return { field: "general" };
}
