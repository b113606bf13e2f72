/**
 * The "full input" sheets of our template (Input, Components, Process steps,
 * Addition order, Materials, Material sources): written from a
 * FormulationInput on export, read back by import-formulation.ts.
 */
import type { FormulationInput, Material } from "@/lib/formulation";
import {
  BASIS_LABELS,
  COMPONENT_COLUMNS,
  INPUT_COLUMNS,
  INPUT_SETTINGS,
  MATERIAL_COLUMNS,
  MODIFIER_COLUMNS,
  NO_HAZARDS,
  ORDER_COLUMNS,
  SHEET,
  SOLVENT_MODE_LABELS,
  SOURCE_COLUMNS,
  STEP_COLUMNS,
  STEP_EXTRA_COLUMNS,
  WATER_RATIO_LABELS,
  type InputSettingKey,
} from "./template";
import { coatingSheet } from "./coating-sheet";
import { sourcePropertyLabel } from "./source-properties";
import type { Cell } from "./types";
import type { SheetSpec } from "./write";

/** Formulation details that are not part of the engine input. */
export interface FormulationMeta {
  name: string;
  project?: string | null;
  description?: string | null;
}

function readPath(material: Material, path: string): unknown {
  let value: unknown = material;
  for (const key of path.split(".")) {
    if (value === null || typeof value !== "object") return undefined;
    value = (value as Record<string, unknown>)[key];
  }
  return value;
}

/**
 * One Materials-sheet row for a material. `nameOf` turns a material id (the
 * carried solvent) into the name written in the sheet; an unknown id is
 * written as it is.
 */
export function materialRow(material: Material, nameOf: (id: string) => string | undefined = () => undefined): Cell[] {
  return MATERIAL_COLUMNS.map((column) => {
    const value = readPath(material, column.path);
    if (column.type === "hazards") {
      if (!Array.isArray(value)) return null;
      return value.length === 0 ? NO_HAZARDS : value.join("; ");
    }
    if (value === undefined || value === null) return null;
    if (column.type === "flag") return value === true ? "yes" : "no";
    if (column.type === "material" && typeof value === "string") return nameOf(value) ?? value;
    return typeof value === "number" || typeof value === "string" ? value : String(value);
  });
}

/** The Materials and Material sources sheets for a list of materials. */
export function materialSheets(materials: readonly Material[]): SheetSpec[] {
  const names = new Map(materials.map((m) => [m.id, m.name]));
  const nameOf = (id: string) => names.get(id);
  const sources: Cell[][] = [];
  for (const material of materials) {
    for (const [property, source] of Object.entries(material.sources ?? {})) {
      sources.push([material.name, sourcePropertyLabel(property), source]);
    }
  }
  return [
    {
      name: SHEET.materials,
      header: [MATERIAL_COLUMNS.map((c) => c.header)],
      rows: materials.map((m) => materialRow(m, nameOf)),
      widths: MATERIAL_COLUMNS.map((c) => c.width),
    },
    { name: SHEET.sources, header: [[...SOURCE_COLUMNS]], rows: sources, widths: [34, 34, 90] },
  ];
}

/** The Input, Components, Modifiers, Coating, Process steps, Addition order, Materials and Material sources sheets. */
export function inputSheets(input: FormulationInput, meta: FormulationMeta): SheetSpec[] {
  const nameOf = new Map(input.materials.map((m) => [m.id, m.name]));
  const name = (id: string | undefined) => (id === undefined ? null : (nameOf.get(id) ?? id));
  const values: Partial<Record<InputSettingKey, Cell>> = {
    name: meta.name,
    project: meta.project ?? null,
    description: meta.description ?? null,
    basis: BASIS_LABELS[input.basis.type],
    water: name(input.water.materialId),
    waterRatio: WATER_RATIO_LABELS[input.water.ratio],
    waterValue: input.water.value,
    waterReference: name(input.water.referenceId),
    waterCountCarried: input.water.countCarried === undefined ? null : input.water.countCarried ? "yes" : "no",
    solvent: name(input.solvent?.materialId),
    solventMode: input.solvent ? SOLVENT_MODE_LABELS[input.solvent.mode] : null,
    solventValue: input.solvent?.mode === "molPerNetworkAtom" ? input.solvent.value : null,
    catalyst: name(input.catalyst?.materialId),
    catalystValue: input.catalyst?.molPerNetworkAtom ?? null,
    substrate: name(input.substrateId),
    marginC: input.marginC ?? null,
    measuredBulkDensity: input.measuredBulkDensity ?? null,
  };
  const basis = input.basis;
  if (basis.type === "solidMass") values.solidGrams = basis.grams;
  if (basis.type === "solidsContent") {
    values.solMassGrams = basis.solMassGrams;
    values.solidsFraction = basis.solidsFraction;
  }
  if (basis.type === "gelBody") {
    values.volumeMl = basis.volumeMl;
    values.bulkDensity = basis.bulkDensity;
    values.linearShrinkage = basis.linearShrinkage ?? null;
  }
  const settings = (Object.keys(INPUT_SETTINGS) as InputSettingKey[]).map((key): Cell[] => [
    INPUT_SETTINGS[key].label,
    values[key] ?? null,
    INPUT_SETTINGS[key].unit,
  ]);
  return [
    { name: SHEET.input, header: [[...INPUT_COLUMNS]], rows: settings, widths: [24, 40, 40] },
    {
      name: SHEET.components,
      header: [[...COMPONENT_COLUMNS]],
      rows: input.components.map((c) => [name(c.materialId), c.weightFraction]),
      widths: [40, 22],
    },
    {
      name: SHEET.modifiers,
      header: [[...MODIFIER_COLUMNS]],
      rows: (input.modifiers ?? []).map((m) => [name(m.materialId), name(m.precursorId), m.molPerMetal]),
      widths: [36, 36, 22],
    },
    coatingSheet(input),
    {
      name: SHEET.steps,
      header: [[...STEP_COLUMNS, ...STEP_EXTRA_COLUMNS]],
      rows: input.steps.map((s) => [s.name, s.temperatureC, s.durationH, s.stage ?? null, s.atmosphere ?? null]),
      widths: [36, 18, 14, 22, 18],
    },
    {
      name: SHEET.order,
      header: [[...ORDER_COLUMNS]],
      rows: (input.additionOrder ?? []).map((id, index) => [index + 1, name(id)]),
      widths: [10, 40],
    },
    ...materialSheets(input.materials),
  ];
}
