/**
 * The composition a batch actually made, recomputed from the weighed masses
 * with the formulation engine. Arithmetic in decimal.js; plain numbers at
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
import type { LineValues } from "./lines";

/** The composition actually made, beside the target. */
export interface ActualComposition {
  /** Per component (precursor residue or organic phase): target and actual weight fraction of the dry composite. */
  components: { materialId: string; name: string; targetWeightFraction: number; actualWeightFraction: number }[];
  /** Dry composite mass, g. */
  solidGrams: { target: number; actual: number };
  /** mol H2O per mol network-forming atom. */
  effectiveR: { target: number; actual: number };
  /** mol H2O per mol hydrolysable group left after ligand exchange; absent when there are none (colloidal silica alone). */
  effectiveH?: { target: number; actual: number };
  /** The engine's figures for the composition made (volume fractions, theoretical density …), or why they are missing. */
  engine: { composite: FormulationResult["composite"] } | { error: string };
}

/**
 * Recomputes the composition actually made from the weighed masses. Every
 * amount of a dispensed line is proportional to its mass as supplied, so
 * each line's figures are scaled by actual / target: residue (dry phase)
 * masses give the actual weight fractions; network-forming atoms,
 * hydrolysable groups (less those a modifier replaced) and water (carried +
 * added) give the effective R and h; a modifier's actual ratio is its
 * weighed ligand over the weighed metal of its precursor.
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
  const atomsOf = new Map<string, Dec>();
  const ligandOf = new Map<string, Dec>();
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
    if (line.networkAtomMol !== undefined) {
      const a = new Dec(line.networkAtomMol).times(s);
      atoms = atoms.plus(a);
      atomsOf.set(line.materialId, (atomsOf.get(line.materialId) ?? ZERO).plus(a));
    }
    if (line.role === "modifier" && line.moles !== undefined) {
      ligandOf.set(line.materialId, (ligandOf.get(line.materialId) ?? ZERO).plus(new Dec(line.moles).times(s)));
    }
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
  // Modifiers as weighed: a line's ligand shared over the lines on the same modifier by their target amounts.
  const materialsById = new Map(input.materials.map((m) => [m.id, m]));
  const modifiers = (input.modifiers ?? []).map((m, i) => {
    const target = result.modifiers?.[i];
    const totalTarget = (result.modifiers ?? []).filter((r) => r.materialId === m.materialId).reduce((sum, r) => sum + r.ligandMol, 0);
    const ligand = target && totalTarget > 0 ? (ligandOf.get(m.materialId) ?? ZERO).times(target.ligandMol / totalTarget) : ZERO;
    const metal = atomsOf.get(m.precursorId) ?? ZERO;
    return { ...m, molPerMetal: metal.greaterThan(0) ? toNumber(ligand.div(metal)) : m.molPerMetal, ligand, bonded: (target?.bondedGrams ?? 0) > 0 };
  });
  let bondedGrams = ZERO;
  for (const m of modifiers) {
    const data = materialsById.get(m.materialId)?.modifier;
    if (!data) continue;
    groups = groups.minus(m.ligand.times(data.groupsReplacedPerMolecule));
    if (m.bonded) bondedGrams = bondedGrams.plus(m.ligand.times(data.bondedMolarMass));
  }
  const effectiveR = atoms.greaterThan(0) ? water.div(atoms) : ZERO;
  const effectiveH = groups.greaterThan(0) ? water.div(groups) : undefined;

  let engine: ActualComposition["engine"];
  try {
    if (!actualResidue.greaterThan(0)) throw new Error("nothing was weighed into the composite");
    const made: FormulationInput = {
      ...input,
      // The basis is the whole dry composite: the residues and organics weighed, and the bonded ligands.
      basis: { type: "solidMass", grams: toNumber(actualResidue.plus(bondedGrams)) },
      components: components.map((c) => ({ materialId: c.materialId, weightFraction: c.actualWeightFraction })),
      ...(modifiers.length > 0 ? { modifiers: modifiers.map((m) => ({ materialId: m.materialId, precursorId: m.precursorId, molPerMetal: m.molPerMetal })) } : {}),
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
    ...(effectiveH && result.water.effectiveH !== undefined ? { effectiveH: { target: result.water.effectiveH, actual: toNumber(effectiveH) } } : {}),
    engine,
  };
}
