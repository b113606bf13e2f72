/**
 * Batch records: each line's deviation from target, the tolerance check,
 * the composition actually made (recomputed with the formulation engine)
 * and the record's .xlsx export. Arithmetic in decimal.js; plain numbers at
 * full precision out (round only for display).
 */
import {
  computeFormulation,
  isFormulationError,
  type FormulationInput,
  type FormulationResult,
  type RecipeLine,
} from "@/lib/formulation";
import { Dec, toNumber, ZERO } from "@/lib/formulation/decimal";
import { SHEET } from "./template";
import type { Cell } from "./types";
import { buildWorkbook } from "./write";

/** Team default for the relative tolerance on a weighed line: ±1 % (the default; common practice, no source). */
export const DEFAULT_TOLERANCE_FRACTION = 0.01;
/** Default balance readability, g: a two-decimal laboratory balance (same as lib/format.ts). */
export const DEFAULT_BALANCE_RESOLUTION_G = 0.01;

/** The fields of a batch line this module needs. */
export interface LineValues {
  materialId: string;
  name?: string;
  role?: RecipeLine["role"];
  targetGrams?: number;
  targetMl?: number;
  actualGrams: number | null;
  lotNumber: string | null;
  at?: string;
  initials?: string;
}

/** A line's deviation from target. */
export interface LineDeviation {
  /** actual − target, g. */
  absoluteGrams: number;
  /** (actual − target) / target (0.01 = +1 %); null when the target is 0. */
  relative: number | null;
  /** The allowed |actual − target|, g: max(tolerance × target, balance resolution). */
  toleranceGrams: number;
  /** True when |actual − target| is beyond the tolerance. */
  outside: boolean;
}

/**
 * Deviation of an actual mass from its target, and whether it is beyond the
 * tolerance: |actual − target| > max(toleranceFraction × target, resolution).
 *
 * @param targetGrams - g as supplied, from the recipe
 * @param actualGrams - g weighed
 * @param toleranceFraction - relative tolerance (0.01 = ±1 %)
 * @param resolutionGrams - balance readability, g
 * @example
 * ```ts
 * lineDeviation(34.67, 35.0, 0.01, 0.01);
 * // { absoluteGrams: 0.33, relative: 0.0095183…, toleranceGrams: 0.3467, outside: false }
 * ```
 */
export function lineDeviation(targetGrams: number, actualGrams: number, toleranceFraction: number, resolutionGrams: number): LineDeviation {
  const target = new Dec(targetGrams);
  const diff = new Dec(actualGrams).minus(target);
  const byFraction = target.times(toleranceFraction).abs();
  const resolution = new Dec(resolutionGrams);
  const tolerance = byFraction.greaterThan(resolution) ? byFraction : resolution;
  return {
    absoluteGrams: toNumber(diff),
    relative: target.isZero() ? null : toNumber(diff.div(target)),
    toleranceGrams: toNumber(tolerance),
    outside: diff.abs().greaterThan(tolerance),
  };
}

/** The composition actually made, beside the target. */
export interface ActualComposition {
  /** Per component (precursor residue or organic phase): target and actual weight fraction of the dry composite. */
  components: { materialId: string; name: string; targetWeightFraction: number; actualWeightFraction: number }[];
  /** Dry composite mass, g. */
  solidGrams: { target: number; actual: number };
  /** mol H2O per mol network-forming atom. */
  effectiveR: { target: number; actual: number };
  /** mol H2O per mol hydrolysable group. */
  effectiveH: { target: number; actual: number };
  /** The engine's figures for the composition made (volume fractions, theoretical density …), or why they are missing. */
  engine: { composite: FormulationResult["composite"] } | { error: string };
}

/**
 * Recomputes the composition actually made from the weighed masses. Every
 * amount of a dispensed line is proportional to its mass as supplied, so
 * each line's figures are scaled by actual / target: residue (dry phase)
 * masses give the actual weight fractions; network-forming atoms,
 * hydrolysable groups and water (carried + added) give the effective R and h.
 * The actual weight fractions then go through the same engine for the dry
 * composite's volume fractions and theoretical density.
 *
 * Returns null while any line has no actual mass.
 *
 * @example
 * ```ts
 * const made = actualComposition(revision.input, revision.result, batch.lines);
 * made?.effectiveR.actual; // e.g. 3.6363… when the precursor was overdosed by 10 % at R = 4
 * ```
 */
export function actualComposition(
  input: FormulationInput,
  result: FormulationResult,
  lines: readonly LineValues[],
): ActualComposition | null {
  const actualOf = new Map<string, number>();
  for (const line of lines) {
    if (line.actualGrams === null || line.actualGrams === undefined) return null;
    actualOf.set(line.materialId, (actualOf.get(line.materialId) ?? 0) + line.actualGrams);
  }
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  const scale = (line: RecipeLine): Dec => {
    if (line.massGrams <= 0) return ZERO;
    const actual = actualOf.get(line.materialId);
    return actual === undefined ? new Dec(1) : new Dec(actual).div(line.massGrams);
  };
  let targetResidue = ZERO;
  let actualResidue = ZERO;
  let atoms = ZERO;
  let groups = ZERO;
  let water = ZERO;
  const residues = new Map<string, { target: Dec; actual: Dec }>();
  // Each material's share counted once per line, even if a material appears on two lines (e.g. a solvent that is also the fill).
  for (const line of result.lines) {
    const s = scale(line);
    if (line.residueGrams !== undefined) {
      const prev = residues.get(line.materialId) ?? { target: ZERO, actual: ZERO };
      residues.set(line.materialId, { target: prev.target.plus(line.residueGrams), actual: prev.actual.plus(new Dec(line.residueGrams).times(s)) });
      targetResidue = targetResidue.plus(line.residueGrams);
      actualResidue = actualResidue.plus(new Dec(line.residueGrams).times(s));
    }
    if (line.networkAtomMol !== undefined) atoms = atoms.plus(new Dec(line.networkAtomMol).times(s));
    if (line.hydrolysableGroupMol !== undefined) groups = groups.plus(new Dec(line.hydrolysableGroupMol).times(s));
    if (line.carriedWaterMol !== undefined) water = water.plus(new Dec(line.carriedWaterMol).times(s));
    if (line.role === "water" && line.moles !== undefined) water = water.plus(new Dec(line.moles).times(s));
  }
  const components = input.components.map((c) => {
    const r = residues.get(c.materialId);
    return {
      materialId: c.materialId,
      name: names.get(c.materialId) ?? c.materialId,
      targetWeightFraction: c.weightFraction,
      actualWeightFraction: r && actualResidue.greaterThan(0) ? toNumber(r.actual.div(actualResidue)) : 0,
    };
  });
  const effectiveR = atoms.greaterThan(0) ? water.div(atoms) : ZERO;
  const effectiveH = groups.greaterThan(0) ? water.div(groups) : ZERO;

  let engine: ActualComposition["engine"];
  try {
    if (!actualResidue.greaterThan(0)) throw new Error("nothing was weighed into the composite");
    const made: FormulationInput = {
      ...input,
      basis: { type: "solidMass", grams: toNumber(actualResidue) },
      components: components.map((c) => ({ materialId: c.materialId, weightFraction: c.actualWeightFraction })),
      water: { materialId: input.water.materialId, ratio: "R", value: toNumber(effectiveR) },
    };
    delete made.solvent;
    delete made.catalyst;
    delete made.measuredBulkDensity;
    engine = { composite: computeFormulation(made).composite };
  } catch (err) {
    engine = { error: isFormulationError(err) || err instanceof Error ? err.message : "not computed" };
  }
  return {
    components,
    solidGrams: { target: toNumber(targetResidue), actual: toNumber(actualResidue) },
    effectiveR: { target: result.water.effectiveR, actual: toNumber(effectiveR) },
    effectiveH: { target: result.water.effectiveH, actual: toNumber(effectiveH) },
    engine,
  };
}

/** Lines of a new batch, copied from the revision's recipe (lines with a mass to weigh). */
export function batchLinesFrom(input: FormulationInput, result: FormulationResult): LineValues[] {
  const names = new Map(input.materials.map((m) => [m.id, m.name]));
  return result.lines
    .filter((line) => line.massGrams > 0)
    .map((line) => ({
      materialId: line.materialId,
      name: names.get(line.materialId) ?? line.materialId,
      role: line.role,
      targetGrams: line.massGrams,
      targetMl: line.volumeMl,
      actualGrams: null,
      lotNumber: null,
    }));
}

/** What the batch record export needs. */
export interface BatchForExport {
  id: string;
  formulationName: string;
  revisionNumber: number;
  state: string;
  startedByName: string | null;
  closedByName: string | null;
  createdAt: Date | string;
  closedAt: Date | string | null;
  toleranceFraction: number;
  balanceResolutionGrams: number;
  notes: string | null;
  lines: LineValues[];
  composition: ActualComposition | null;
}

function when(value: Date | string | null | undefined): string | null {
  if (!value) return null;
  const d = typeof value === "string" ? new Date(value) : value;
  return Number.isNaN(d.getTime()) ? null : `${d.toISOString().replace("T", " ").slice(0, 16)} UTC`;
}

/** The batch record as an .xlsx workbook: the record, line by line, and the composition made. */
export function batchWorkbook(batch: BatchForExport): Buffer {
  const overview: Cell[][] = [
    ["Formulation", batch.formulationName, ""],
    ["Revision", batch.revisionNumber, ""],
    ["Batch record", batch.id, ""],
    ["State", batch.state, ""],
    ["Started", when(batch.createdAt), batch.startedByName ?? ""],
    ["Closed", when(batch.closedAt) ?? "open", batch.closedByName ?? ""],
    ["Tolerance per line", batch.toleranceFraction, "fraction of the target (or the balance resolution, whichever is larger)"],
    ["Balance resolution", batch.balanceResolutionGrams, "g"],
    ["Notes", batch.notes ?? "", ""],
  ];
  const lineRows: Cell[][] = batch.lines.map((line, index) => {
    const dev =
      line.actualGrams !== null && line.targetGrams !== undefined
        ? lineDeviation(line.targetGrams, line.actualGrams, batch.toleranceFraction, batch.balanceResolutionGrams)
        : null;
    return [
      index + 1,
      line.name ?? line.materialId,
      line.lotNumber,
      line.targetGrams ?? null,
      line.targetMl ?? null,
      line.actualGrams,
      dev?.absoluteGrams ?? null,
      dev?.relative ?? null,
      dev?.toleranceGrams ?? null,
      dev ? (dev.outside ? "outside tolerance" : "within tolerance") : "not weighed",
      line.at ?? null,
      line.initials ?? null,
    ];
  });
  const c = batch.composition;
  const made: Cell[][] = c
    ? [
        ...c.components.map((x): Cell[] => [x.name, x.targetWeightFraction, x.actualWeightFraction]),
        [null, null, null],
        ["Dry composite mass (g)", c.solidGrams.target, c.solidGrams.actual],
        ["Effective water ratio R (mol H2O per mol network atom)", c.effectiveR.target, c.effectiveR.actual],
        ["Effective water ratio h (mol H2O per mol hydrolysable group)", c.effectiveH.target, c.effectiveH.actual],
        ...("composite" in c.engine
          ? [["Theoretical density of the composite made (g/cm³)", null, c.engine.composite.theoreticalDensity] as Cell[]]
          : [["Composite not computed", null, c.engine.error] as Cell[]]),
      ]
    : [["Enter every line's actual mass to see the composition made.", null, null]];
  return buildWorkbook([
    { name: SHEET.overview, header: [["Item", "Value", "Note"]], rows: overview, widths: [24, 44, 60] },
    {
      name: SHEET.batchRecord,
      header: [
        [
          "Order",
          "Material",
          "Lot number",
          "Target mass (g)",
          "Target volume (mL)",
          "Actual mass (g)",
          "Deviation (g)",
          "Deviation (fraction of target)",
          "Tolerance (g)",
          "Check",
          "Time (UTC)",
          "Initials",
        ],
      ],
      rows: lineRows,
      widths: [7, 34, 16, 14, 14, 14, 12, 14, 12, 18, 24, 9],
    },
    {
      name: SHEET.actual,
      header: [["Component", "Target weight fraction (mass fraction)", "Actual weight fraction (mass fraction)"]],
      rows: made,
      widths: [56, 22, 22],
    },
  ]);
}
