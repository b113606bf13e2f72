/**
 * Inputs shared by the explorer's unit tests (not part of its API): the demo
 * visor hard coat (db/demo.ts: GPTMS + TEOS + titanium isopropoxide chelated
 * 1:1 with acetylacetone, solids-content basis, ethanol fill, HCl, on
 * polycarbonate), here dip coated so that film figures exist. Reference
 * materials from data/materials.ts.
 */
import { referenceMaterials } from "../../data/materials";
import type { FormulationInput } from "../formulation/input-schema";
import type { Material } from "../formulation/material-schema";

function ref(id: string): Material {
  const found = referenceMaterials.find((m) => m.id === id);
  if (!found) throw new Error(`no reference material ${id}`);
  return found;
}

/** The visor hard coat with `titania` weight fraction of titanium isopropoxide (residue TiO2); TEOS takes 0.3 − titania. */
export function visorCoat(titania = 0.05): FormulationInput {
  return {
    materials: ["gptms", "teos", "ti-isopropoxide", "acac", "ethanol", "water-di", "hcl-37", "polycarbonate"].map(ref),
    basis: { type: "solidsContent", solMassGrams: 500, solidsFraction: 0.2 },
    components: [
      { materialId: "gptms", weightFraction: 0.7 },
      { materialId: "teos", weightFraction: Number((0.3 - titania).toFixed(4)) },
      { materialId: "ti-isopropoxide", weightFraction: titania },
    ],
    modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
    water: { materialId: "water-di", ratio: "R", value: 1.5 },
    solvent: { materialId: "ethanol", mode: "fill" },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    substrateId: "polycarbonate",
    steps: [
      { name: "Hydrolysis, stirred", temperatureC: 25, durationH: 2, stage: "sol" },
      { name: "Ageing of the sol", temperatureC: 25, durationH: 24, stage: "sol" },
      { name: "Flash-off after dip coating", temperatureC: 60, durationH: 0.25, stage: "drying" },
      { name: "Thermal cure", temperatureC: 120, durationH: 2, stage: "curing" },
    ],
    marginC: 20,
    coating: { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24 },
  };
}
