/**
 * The numeric fast path of the engine: every exploration figure of one
 * point in plain float64, from the same equations as computeFormulation
 * (lib/formulation/compute.ts) but without decimal.js, without validation
 * and without notices. Materials are indexed once when the model is built.
 * The decimal engine stays the source of every saved or released recipe;
 * the property test numeric.property.test.ts holds the two within 1e-9.
 */
import { DEFAULT_THERMAL_MARGIN_C, MIN_LINE_GRAMS, ML_PER_L, WATER_MOLAR_MASS_G_PER_MOL } from "../constants";
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import { numericCoatHook, type CoatHook } from "./coat-hook";
import { composePoint, pointState, type PointState } from "./composition";
import type { NumericCoatFigures } from "./context";
import type { NumericFigures, NumericModel, NumericOutcome, NumericPhase } from "./figures";
import { numericFill } from "./fill";
import { materialTable, molarMassOfRow, positionOf, volumeMl, type MaterialTable, type TableMaterial } from "./material-table";
import { NumericRefusal, refuse } from "./refusal";
import { thermalVerdict } from "./thermal";

/** The coat figures before the coat path is wired in: all NaN. */
const NO_COAT: NumericCoatFigures = {
  wetThicknessUm: Number.NaN,
  dryThicknessNm: Number.NaN,
  coverageM2PerL: Number.NaN,
  capillaryNumber: Number.NaN,
  refractiveIndex: Number.NaN,
  indexMismatch: Number.NaN,
  vocMassGrams: Number.NaN,
  vocGramsPerLitre: Number.NaN,
  vocGramsPerLitreLessWater: Number.NaN,
  cureRatio: Number.NaN,
  costTotal: Number.NaN,
  costPerKgDry: Number.NaN,
  costPerLitreSol: Number.NaN,
  costPerM2: Number.NaN,
};

/** S, g of dry composite, from the basis (basis.ts). */
function solidMassOf(basis: FormulationInput["basis"]): number {
  switch (basis.type) {
    case "solidMass":
      return basis.grams;
    case "solidsContent":
      return basis.solidsFraction * basis.solMassGrams;
    case "gelBody": {
      const remaining = 1 - (basis.linearShrinkage ?? 0);
      return basis.bulkDensity * basis.volumeMl * (remaining * remaining * remaining);
    }
  }
}

/**
 * A dosed line (catalyst, solvent): mass = n · M / assay, with its carried water and solvent;
 * pushed onto the point's lines when its mass reaches `minGrams`.
 */
function doseLine(state: PointState, row: TableMaterial, role: "catalyst" | "solvent", moles: number, minGrams: number): { massGrams: number; carriedWaterMol: number } {
  const massGrams = moles * molarMassOfRow(row) * row.perAssay;
  const volume = volumeMl(row, massGrams);
  const carriedWaterMol = massGrams * row.waterMolPerGram;
  if (massGrams >= minGrams) {
    state.lines.push({ materialId: row.id, role, massGrams, volumeMl: volume, moles, residueGrams: 0, carriedSolventGrams: massGrams * row.solventFraction });
    state.rows.push(row);
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

/** What the point's solvent and water came to. */
interface Liquids {
  solventAddedGrams: number;
  solventMolPerNetworkAtom: number;
  addMol: number;
  addGrams: number;
  solMass: number;
  solVolume: number;
  totalWaterMol: number;
  waterRow: TableMaterial;
}

function liquids(input: FormulationInput, table: MaterialTable, state: PointState): Liquids {
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
      state.lines.push({ materialId: solventRow.id, role: "solvent", massGrams: grams, volumeMl: volume, moles: Number.isNaN(addedMol) ? 0 : addedMol, residueGrams: 0, carriedSolventGrams: 0 });
      state.rows.push(solventRow);
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
    state.lines.push({ materialId: waterRow.id, role: "water", massGrams: addGrams, volumeMl: addMl, moles: addMol, residueGrams: 0, carriedSolventGrams: 0 });
    state.rows.push(waterRow);
    solMass += addGrams;
    solVolume += addMl;
  }
  return { solventAddedGrams, solventMolPerNetworkAtom, addMol, addGrams, solMass, solVolume, totalWaterMol: state.carriedWaterMol + addMol, waterRow };
}

/** 1 − ∛r, volumetric 1 − r, for r = solid volume / sol volume. */
function shrinkageOf(ratio: number): { linear: number; volumetric: number } {
  return { volumetric: 1 - ratio, linear: 1 - Math.cbrt(ratio) };
}

function evaluatePoint(input: FormulationInput, table: MaterialTable, state: PointState, coat: CoatHook | undefined): NumericFigures {
  const solidMass = solidMassOf(input.basis);
  composePoint(input, table, solidMass, state);
  const l = liquids(input, table, state);
  const { solMass, solVolume } = l;

  // Dry composite: φ_k = (w_k/ρ_k) · ρ_th, ρ_th = 1 / Σ(w_j/ρ_j).
  let totalSpecificVolume = 0;
  for (const phase of state.phases) totalSpecificVolume += phase.weightFraction / phase.density;
  const theoreticalDensity = 1 / totalSpecificVolume;
  let organicWeightFraction = 0;
  let organicVolumeFraction = 0;
  let organicContent = 0;
  const phases: NumericPhase[] = new Array<NumericPhase>(state.phases.length);
  for (let k = 0; k < state.phases.length; k += 1) {
    const p = state.phases[k]!;
    const volumeFraction = (p.weightFraction / p.density) * theoreticalDensity;
    if (p.organic) {
      organicWeightFraction += p.weightFraction;
      organicVolumeFraction += volumeFraction;
    }
    organicContent += p.weightFraction * p.share;
    phases[k] = { materialId: p.materialId, organic: p.organic, weightFraction: p.weightFraction, volumeFraction };
  }
  const dense = shrinkageOf(solidMass / theoreticalDensity / solVolume);
  const bulk = input.measuredBulkDensity ?? (input.basis.type === "gelBody" ? input.basis.bulkDensity : undefined);
  let porosity = Number.NaN;
  if (bulk !== undefined) {
    if (bulk > theoreticalDensity) refuse("bulk_density_above_theoretical", input.measuredBulkDensity !== undefined ? "measuredBulkDensity" : "basis.bulkDensity");
    porosity = 1 - bulk / theoreticalDensity;
  }

  if (input.substrateId !== undefined) {
    const substrate = table.materials[positionOf(table, input.substrateId, "substrateId")]!;
    if (substrate.thermal) state.subjects.push(substrate.thermal);
  }
  const thermal = thermalVerdict(state.subjects, state.conversionsC, input.steps, input.marginC ?? DEFAULT_THERMAL_MARGIN_C);

  let coatFigures = NO_COAT;
  if (coat) {
    const alcohols = state.alcoholOrder.map((slot) => ({ mol: state.alcoholMol[slot]!, molarMass: table.alcohols[slot]!.molarMass }));
    const outcome = coat({
      input,
      byId: table.byId,
      lines: state.lines,
      phases: state.phases,
      solidMass,
      solMass,
      solVolume,
      totalWaterMol: l.totalWaterMol,
      waterMaterial: l.waterRow.material,
      alcohols,
      theoreticalDensity,
      porosity: Number.isNaN(porosity) ? 0 : porosity,
    });
    if ("ok" in outcome) throw new NumericRefusal(outcome.code, outcome.field);
    coatFigures = outcome;
  }

  return {
    solMassGrams: solMass,
    solVolumeMl: solVolume,
    solidsFraction: solidMass / solMass,
    residueGramsPerL: (solidMass * ML_PER_L) / solVolume,
    compositeMassGrams: solidMass,
    theoreticalDensity,
    porosity,
    denseLinearShrinkage: dense.linear,
    denseVolumetricShrinkage: dense.volumetric,
    organicWeightFraction,
    organicVolumeFraction,
    organicContent,
    phases,
    effectiveR: l.totalWaterMol / state.networkAtomMol,
    effectiveH: state.groupMol === 0 ? Number.NaN : l.totalWaterMol / state.groupMol,
    waterAddGrams: l.addGrams,
    solventAddedGrams: l.solventAddedGrams,
    solventMolPerNetworkAtom: l.solventMolPerNetworkAtom,
    thermalStatus: thermal.status,
    maxAllowedC: thermal.maxAllowedC,
    wetThicknessUm: coatFigures.wetThicknessUm,
    dryThicknessNm: coatFigures.dryThicknessNm,
    coverageM2PerL: coatFigures.coverageM2PerL,
    capillaryNumber: coatFigures.capillaryNumber,
    refractiveIndex: coatFigures.refractiveIndex,
    indexMismatch: coatFigures.indexMismatch,
    vocMassGrams: coatFigures.vocMassGrams,
    vocGramsPerLitre: coatFigures.vocGramsPerLitre,
    vocGramsPerLitreLessWater: coatFigures.vocGramsPerLitreLessWater,
    cureRatio: coatFigures.cureRatio,
    costTotal: coatFigures.costTotal,
    costPerKgDry: coatFigures.costPerKgDry,
    costPerLitreSol: coatFigures.costPerLitreSol,
    costPerM2: coatFigures.costPerM2,
  };
}

/**
 * A NumericModel that computes every exploration figure in plain float64.
 * Inputs must already be valid (formulationInputSchema); a point the engine
 * would refuse while computing gives `{ ok: false, code, field }` with the
 * engine's code and field.
 *
 * @param materials - the materials every evaluated input uses (indexed once)
 * @returns the model
 * @example
 * ```ts
 * const model = numericModel(input.materials);
 * const outcome = model.evaluate({ ...input, water: { ...input.water, value: 6 } });
 * if (outcome.ok) outcome.figures.solidsFraction; // dry composite / sol mass
 * ```
 */
export function numericModel(materials: readonly Material[]): NumericModel {
  const coat = numericCoatHook;
  const table = materialTable(materials);
  const state = pointState(table);
  return {
    evaluate(input: FormulationInput): NumericOutcome {
      try {
        return { ok: true, figures: evaluatePoint(input, table, state, coat) };
      } catch (error) {
        if (error instanceof NumericRefusal) return error.toFailure();
        throw error;
      }
    },
  };
}
