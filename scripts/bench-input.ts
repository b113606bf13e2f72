/**
 * The formulation the engine and explorer benchmarks time: n − 1 precursor
 * copies (TEOS, GPTMS, MTES, Ti and Zr alkoxides, triethyl phosphate in
 * turn) and one organic phase, on a 500 g sol at 15 % solids filled with
 * ethanol, water R = 4, HCl 37 % at 0.01 mol per mol network atom, a
 * polycarbonate substrate and three steps.
 */
import { referenceMaterial } from "../data/materials";
import type { FormulationInput, Material } from "../lib/formulation";

/** A formulation with n components: n − 1 precursor copies and one organic phase (n ≥ 2). */
export function makeInput(n: number): FormulationInput {
  const bases = ["teos", "gptms", "mtes", "ti-isopropoxide", "zr-propoxide-70", "triethyl-phosphate"].map(referenceMaterial);
  const precursors: Material[] = [];
  for (let i = 0; i < n - 1; i += 1) {
    const base = bases[i % bases.length] as Material;
    precursors.push({ ...base, id: `${base.id}-${i}`, name: `${base.name} #${i}` });
  }
  const organic = referenceMaterial("peg-2000");
  const share = 1 / n;
  return {
    materials: [
      ...precursors,
      organic,
      referenceMaterial("ethanol"),
      referenceMaterial("water-di"),
      referenceMaterial("hcl-37"),
      referenceMaterial("polycarbonate"),
    ],
    basis: { type: "solidsContent", solMassGrams: 500, solidsFraction: 0.15 },
    components: [
      ...precursors.map((material) => ({ materialId: material.id, weightFraction: share })),
      { materialId: organic.id, weightFraction: 1 - share * (n - 1) },
    ],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    solvent: { materialId: "ethanol", mode: "fill" },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    substrateId: "polycarbonate",
    steps: [
      { name: "Hydrolysis", temperatureC: 25, durationH: 2 },
      { name: "Drying", temperatureC: 60, durationH: 1 },
      { name: "Cure", temperatureC: 110, durationH: 2 },
    ],
  };
}

