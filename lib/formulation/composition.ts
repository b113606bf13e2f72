import type { PhaseInput } from "./composite";
import { add, type Dec, dec, quotient, toNumber, ZERO } from "./decimal";
import type { Component } from "./input-schema";
import { materialById, type IndexedMaterial } from "./material-index";
import { organicAmounts } from "./organic";
import { precursorAmounts, requirePrecursorData } from "./precursor";
import type { ConversionSubject, ThermalSubject } from "./thermal";

/** A recipe line in decimal figures (turned into a RecipeLine at the end). */
export interface DecLine {
  materialId: string;
  role: "precursor" | "organic" | "solvent" | "water" | "catalyst" | "modifier";
  moles?: Dec;
  massGrams: Dec;
  volumeMl: Dec;
  residueGrams?: Dec;
  networkAtomMol?: Dec;
  hydrolysableGroupMol?: Dec;
  carriedWaterMol?: Dec;
  carriedSolventGrams?: Dec;
}

/** What the components of the dry composite add up to. */
export interface CompositionPass {
  lines: DecLine[];
  phases: PhaseInput[];
  subjects: ThermalSubject[];
  conversions: ConversionSubject[];
  /** Alcohol released on full hydrolysis, one entry per name and molar mass, in order of first appearance. */
  alcohols: { name: string; molarMass: number; mol: Dec }[];
  /** Σa, mol network-forming atoms. */
  networkAtomMol: Dec;
  /** Σg, mol hydrolysable groups before any ligand exchange. */
  hydrolysableGroupMol: Dec;
  /** Water carried by the components, mol. */
  carriedWaterMol: Dec;
  /** Per precursor id: mol of molecules and of network-forming atoms. */
  precursorMol: Map<string, { moles: Dec; atoms: Dec }>;
  /** Fast-hydrolysing alkoxides present. */
  fastHydrolysing: { id: string; name: string; path: string }[];
}

/**
 * The components of the dry composite (chemistry: "Per precursor i"): each
 * precursor's and organic phase's recipe line, its phase in the composite
 * and its thermal subject. `freeMass` is the ligand-free dry mass the
 * weight fractions apply to; `solidMass` the whole dry composite, over
 * which the phases' weight fractions are reported.
 *
 * @param components - the components, with weight fractions already scaled to sum to 1 (and the number entered when unscaled)
 * @param byId - the indexed materials
 * @param freeMass - S_free, g
 * @param solidMass - S, g
 * @returns the lines, phases and sums
 * @example
 * ```ts
 * composeComponents([{ materialId: "teos", weightFraction: new Dec(1) }], byId, new Dec(10), new Dec(10)).networkAtomMol;
 * // 10 / 60.083 mol Si
 * ```
 */
export function composeComponents(
  components: readonly (Omit<Component, "weightFraction"> & { weightFraction: Dec; value?: number })[],
  byId: Map<string, IndexedMaterial>,
  freeMass: Dec,
  solidMass: Dec,
): CompositionPass {
  const pass: CompositionPass = {
    lines: [],
    phases: [],
    subjects: [],
    conversions: [],
    alcohols: [],
    networkAtomMol: ZERO,
    hydrolysableGroupMol: ZERO,
    carriedWaterMol: ZERO,
    precursorMol: new Map(),
    fastHydrolysing: [],
  };
  const share = freeMass.equals(solidMass) ? undefined : quotient(freeMass, solidMass);
  components.forEach((component, index) => {
    // the error field is only written out when the lookup misses
    const entry = byId.get(component.materialId) ?? materialById(byId, component.materialId, `components.${index}.materialId`);
    const material = entry.material;
    const weightFraction = component.weightFraction;
    const phaseFraction = share ? weightFraction.times(share) : weightFraction;
    // The number as entered when nothing scaled it (saves a decimal-to-number conversion).
    const phaseFractionValue = share || component.value === undefined ? toNumber(phaseFraction) : component.value;
    const present = !weightFraction.isZero();
    if (material.kind === "precursor") {
      const data = requirePrecursorData(entry);
      const a = precursorAmounts(entry, weightFraction, freeMass);
      pass.lines.push({
        materialId: material.id,
        role: "precursor",
        moles: a.moles,
        massGrams: a.massGrams,
        volumeMl: a.volumeMl,
        residueGrams: a.residueGrams,
        networkAtomMol: a.networkAtomMol,
        hydrolysableGroupMol: a.hydrolysableGroupMol,
        carriedWaterMol: a.carriedWaterMol,
        carriedSolventGrams: a.carriedSolventGrams,
      });
      pass.phases.push({
        materialId: material.id,
        residueFormula: data.residueFormula,
        weightFraction: phaseFraction,
        weightFractionValue: phaseFractionValue,
        density: dec(data.residueDensity),
        densityValue: data.residueDensity,
      });
      pass.networkAtomMol = add(pass.networkAtomMol, a.networkAtomMol);
      pass.hydrolysableGroupMol = add(pass.hydrolysableGroupMol, a.hydrolysableGroupMol);
      pass.carriedWaterMol = add(pass.carriedWaterMol, a.carriedWaterMol);
      pass.precursorMol.set(material.id, { moles: a.moles, atoms: a.networkAtomMol });
      if (present && material.fastHydrolysing) pass.fastHydrolysing.push({ id: material.id, name: material.name, path: entry.path });
      const leaving = data.leavingAlcohol;
      if (leaving && present && !a.alcoholMol.isZero()) {
        const previous = pass.alcohols.find((alcohol) => alcohol.name === leaving.name && alcohol.molarMass === leaving.molarMass);
        if (previous) previous.mol = add(previous.mol, a.alcoholMol);
        else pass.alcohols.push({ name: leaving.name, molarMass: leaving.molarMass, mol: a.alcoholMol });
      }
      if (present && data.conversionTemperatureC !== undefined) {
        pass.conversions.push({
          materialId: material.id,
          name: material.name,
          residueFormula: data.residueFormula,
          conversionTemperatureC: data.conversionTemperatureC,
          path: entry.path,
        });
      }
    } else {
      const a = organicAmounts(entry, weightFraction, freeMass);
      pass.lines.push({
        materialId: material.id,
        role: "organic",
        moles: a.moles,
        massGrams: a.massGrams,
        volumeMl: a.volumeMl,
        residueGrams: a.residueGrams,
        carriedWaterMol: a.carriedWaterMol,
        carriedSolventGrams: a.carriedSolventGrams,
      });
      pass.phases.push({
        materialId: material.id,
        weightFraction: phaseFraction,
        weightFractionValue: phaseFractionValue,
        density: dec(a.phaseDensity),
        densityValue: a.phaseDensity,
      });
      pass.carriedWaterMol = add(pass.carriedWaterMol, a.carriedWaterMol);
      if (present) pass.subjects.push({ materialId: material.id, name: material.name, role: "organic", thermal: material.thermal, path: entry.path });
    }
  });
  return pass;
}
