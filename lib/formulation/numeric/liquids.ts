/**
 * Catalyst, solvent and water of one point of the numeric path, plain
 * float64: the same order and equations as compute.ts with dosing.ts,
 * solvent.ts, solvent-fill.ts and water.ts.
 */
import { MIN_LINE_GRAMS, WATER_MOLAR_MASS_G_PER_MOL } from "../constants";
import type { FormulationInput } from "../input-schema";
import { numericFill } from "./fill";
import { molarMassOfRow, positionOf, volumeMl, type MaterialTable, type TableMaterial } from "./material-table";
import { addLine, type PointState } from "./point-state";
import { refuse } from "./refusal";

/**
 * A dosed line (catalyst, solvent): mass = n · M / assay, with its carried water and solvent;
 * pushed onto the point's lines when its mass reaches `minGrams`.
 */
function doseLine(state: PointState, row: TableMaterial, role: "catalyst" | "solvent", moles: number, minGrams: number): { massGrams: number; carriedWaterMol: number } {
  const massGrams = moles * molarMassOfRow(row) * row.perAssay;
  const volume = volumeMl(row, massGrams);
  const carriedWaterMol = massGrams * row.waterMolPerGram;
  if (massGrams >= minGrams) {
    addLine(state, row, role, massGrams, volume, moles, 0, massGrams * row.solventFraction);
    state.carriedWaterMol += carriedWaterMol;
  }
  return { massGrams, carriedWaterMol };
}

/** g of the solvent at `solventIndex` carried by the lines so far (materials naming it as solventId). */
function carriedSolvent(state: PointState, solventIndex: number): number {
  let grams = 0;
  for (let i = 0; i < state.lines.length; i += 1) if (state.rows[i]!.solventIndex === solventIndex) grams += state.lines[i]!.carriedSolventGrams;
  return grams;
}

/** What the point's solvent and water came to (units in the names; NaN where the engine has no value). */
export interface Liquids {
  solventAddedGrams: number;
  solventMolPerNetworkAtom: number;
  addMol: number;
  addGrams: number;
  solMass: number;
  solVolume: number;
  totalWaterMol: number;
  waterRow: TableMaterial;
}

/**
 * The catalyst, the solvent (by molar ratio, counting what precursor solutions carry, or a fill) and the
 * water (by R, h or per precursor, counting carried water or not) of one point, as compute.ts adds them,
 * with the sol's mass and volume.
 *
 * @param input - the point's input
 * @param table - the model's materials
 * @param state - the point's state after composePoint
 * @returns the solvent and water figures and the sol totals
 * @example
 * ```ts
 * liquids(input, table, composePoint(input, table, 10, state)).solMass; // g
 * ```
 */
export function liquids(input: FormulationInput, table: MaterialTable, state: PointState): Liquids {
  const atoms = state.networkAtomMol;
  const water = input.water;
  if (water.ratio === "h" && !(state.groupMol > 0)) refuse("no_hydrolysable_groups", "water.ratio");
  if (input.catalyst && input.catalyst.molPerNetworkAtom > 0) {
    const row = table.materials[positionOf(table, input.catalyst.materialId, "catalyst.materialId")]!;
    doseLine(state, row, "catalyst", input.catalyst.molPerNetworkAtom * atoms, Number.NEGATIVE_INFINITY);
  }
  let solventAddedGrams = Number.NaN;
  let solventMolPerNetworkAtom = Number.NaN;
  const solventIndex = input.solvent ? positionOf(table, input.solvent.materialId, "solvent.materialId") : -1;
  const solventRow = solventIndex >= 0 ? table.materials[solventIndex] : undefined;
  if (input.solvent?.mode === "molPerNetworkAtom" && solventRow) {
    const carried = carriedSolvent(state, solventIndex);
    const carriedMol = carried === 0 ? 0 : carried / molarMassOfRow(solventRow);
    const addMol = input.solvent.value * atoms - carriedMol;
    solventAddedGrams = 0;
    let addedMol = 0;
    if (addMol > 0) {
      addedMol = addMol;
      // Below MIN_LINE_GRAMS the line is left out, but the summary still reports the grams.
      solventAddedGrams = doseLine(state, solventRow, "solvent", addMol, MIN_LINE_GRAMS).massGrams;
    }
    const ratio = (addedMol + carriedMol) / atoms;
    if (Number.isFinite(ratio)) solventMolPerNetworkAtom = ratio;
  }

  const waterRow = table.materials[positionOf(table, water.materialId, "water.materialId")]!;
  const waterMolarMass = Number.isNaN(waterRow.molarMass) ? WATER_MOLAR_MASS_G_PER_MOL : waterRow.molarMass;
  let basisMol: number;
  if (water.ratio === "R") basisMol = atoms;
  else if (water.ratio === "h") basisMol = state.groupMol;
  else {
    const moles = state.precursorMoles[table.indexOf.get(water.referenceId ?? "") ?? -1];
    basisMol = moles === undefined || Number.isNaN(moles) ? 0 : moles;
  }
  const targetMol = water.value * basisMol;
  const countCarried = water.countCarried ?? true;

  let solMass = 0;
  let solVolume = 0;
  for (const line of state.lines) {
    solMass += line.massGrams;
    solVolume += line.volumeMl;
  }
  let addMol: number;
  const basis = input.basis;
  if (input.solvent?.mode === "fill" && solventRow) {
    if (basis.type === "solidMass") refuse("nothing_to_fill", "solvent.mode");
    const fill = numericFill({
      volume: basis.type === "gelBody",
      amount: basis.type === "gelBody" ? basis.volumeMl : basis.solMassGrams,
      otherGrams: solMass,
      otherMl: solVolume,
      waterNeededMol: countCarried ? targetMol - state.carriedWaterMol : targetMol,
      waterMolarMass,
      solvent: solventRow,
      water: waterRow,
    });
    const grams = fill.solventGrams;
    const carriedWater = grams * solventRow.waterMolPerGram;
    let addedMol = Number.NaN;
    if (grams > 0) {
      const volume = volumeMl(solventRow, grams);
      addedMol = Number.isNaN(solventRow.molarMass) ? Number.NaN : (grams * (solventRow.material.assay ?? 1)) / solventRow.molarMass;
      addLine(state, solventRow, "solvent", grams, volume, Number.isNaN(addedMol) ? 0 : addedMol, 0, 0);
      solMass += grams;
      solVolume += volume;
    }
    state.carriedWaterMol += carriedWater;
    addMol = fill.addWaterMol;
    solventAddedGrams = grams > 0 ? grams : 0;
    const carriedMol = Number.isNaN(solventRow.molarMass) ? Number.NaN : carriedSolvent(state, solventIndex) / solventRow.molarMass;
    const ratio = (addedMol + carriedMol) / atoms;
    if (Number.isFinite(ratio)) solventMolPerNetworkAtom = ratio;
  } else {
    addMol = countCarried ? Math.max(targetMol - state.carriedWaterMol, 0) : targetMol;
  }

  let addGrams = 0;
  if (addMol * waterMolarMass < MIN_LINE_GRAMS) addMol = 0;
  if (addMol > 0) {
    addGrams = addMol * waterMolarMass;
    const addMl = volumeMl(waterRow, addGrams);
    addLine(state, waterRow, "water", addGrams, addMl, addMol, 0, 0);
    solMass += addGrams;
    solVolume += addMl;
  }
  return { solventAddedGrams, solventMolPerNetworkAtom, addMol, addGrams, solMass, solVolume, totalWaterMol: state.carriedWaterMol + addMol, waterRow };
}
