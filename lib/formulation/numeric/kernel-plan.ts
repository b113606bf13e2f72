/**
 * What the numeric kernel resolves once per input structure (kernel.ts runs
 * it per point): each component's table row and its coefficients, linear in
 * its grams of residue (g and mL as supplied, mol, network atoms, groups,
 * carried water and solvent, VOC, price, epoxy and amine, optics term), the
 * catalyst, solvent and water lines' coefficients per gram, the basis, the
 * coat and the thermal subjects. An input the kernel does not cover
 * (modifiers, a material lacking a number a line needs, an unknown id …)
 * gets no plan: every point then takes the general branch (model.ts).
 */
import { DEFAULT_THERMAL_MARGIN_C, WATER_MOLAR_MASS_G_PER_MOL } from "../constants";
import type { CoatingSpec, FormulationInput, ProcessStep } from "../input-schema";
import { coatMaterialData } from "./coat-material";
import * as layout from "./kernel-layout";
import type { Knob } from "./knobs";
import type { MaterialTable, TableMaterial } from "./material-table";
import type { ThermalProfile } from "./thermal";

// Local copies, read once (an imported binding is a getter where modules are compiled one by one).
const { C_AMINE, C_ATOMS, C_CONVERSION, C_COST, C_EPOXY, C_GROUPS, C_MASS, C_MOLES, C_OPTICS, C_ORGANIC, C_ORGANIC_SPECIFIC, C_PHASE_DENSITY } = layout;
const { C_SHARE, C_SOLVENT, C_SPECIFIC, C_VOC, C_VOLUME, C_WATER, KNOB_SOLIDS, KNOB_SPEED, KNOB_STEP, KNOB_WATER, KNOB_WEIGHT, STRIDE, zeros } = layout;
const materialData = coatMaterialData;

/** Per gram as supplied of a catalyst, solvent or water line. */
export interface LineCoefficients {
  perDensity: number;
  waterMolPerGram: number;
  /** g of the sol's solvent carried per g (0 unless the line's material names it). */
  solventPerGram: number;
  vocPerGram: number;
  /** per kg, NaN without a price */
  price: number;
  epoxyPerGram: number;
  aminePerGram: number;
}


/** The structure of one input, resolved; per component arrays are in the input's component order. */
export interface KernelPlan {
  n: number;
  knobCode: number[];
  /** Component or step index per knob (−1 when none). */
  knobIndex: number[];
  /** How many leading knobs set the weight fractions of components 0, 1, 2 … in order (read as a block). */
  leadingWeights: number;
  weights: number[];
  /** STRIDE coefficients per component (C_MASS …). */
  coef: number[];
  /** Thermal subject of a present component (organic phase), or its precursor's conversion temperature. */
  subject: (ThermalProfile | undefined)[];
  /** Components whose presence changes the thermal verdict. */
  thermalComponents: number[];
  basisType: FormulationInput["basis"]["type"];
  /** Solids-content basis: sol mass and solids fraction; solid-mass basis: grams in solMassGrams; gel body: S. */
  solMassGrams: number;
  solidsFraction: number;
  fixedSolidMass: number;
  bulkDensity: number;
  catalystRatio: number;
  catalystGramsPerMol: number;
  catalyst: LineCoefficients | undefined;
  /** 0 none, 1 mol per network atom, 2 fill. */
  solventMode: number;
  solventValue: number;
  solventMolarMass: number;
  solventGramsPerMol: number;
  solventAssay: number;
  /** The per-atom line (carries its own solvent) and the fill line (carries none). */
  solventLine: LineCoefficients | undefined;
  fillLine: LineCoefficients | undefined;
  fillVolume: boolean;
  fillAmount: number;
  /** 0 R, 1 h, 2 per precursor. */
  waterRatio: number;
  waterValue: number;
  /** Component whose mol the per-precursor water counts, −1 when none. */
  waterReference: number;
  countCarried: boolean;
  waterMolarMass: number;
  waterDensity: number;
  waterLine: LineCoefficients;
  coating: CoatingSpec | undefined;
  substrate: ThermalProfile | undefined;
  substrateIndex: number;
  steps: ProcessStep[];
  marginC: number;
  stepsVary: boolean;
}

function lineOf(row: TableMaterial, table: MaterialTable, solventIndex: number, roleVolatile: boolean, carries: boolean): LineCoefficients {
  const data = materialData(row.material);
  const carried = row.material.solventId === undefined ? undefined : table.byId.get(row.material.solventId);
  const carriedVolatile = !carried || materialData(carried).volatile;
  const solventFraction = carries ? row.solventFraction : 0;
  return {
    perDensity: row.perDensity,
    waterMolPerGram: row.waterMolPerGram,
    solventPerGram: row.solventIndex === solventIndex && solventIndex >= 0 ? solventFraction : 0,
    vocPerGram: (roleVolatile && data.volatile ? data.assayFactor : 0) + (carriedVolatile ? solventFraction : 0),
    price: data.pricePerKg,
    epoxyPerGram: data.curing ? data.assayFactor * data.epoxyPerGram : 0,
    aminePerGram: data.curing ? data.assayFactor * data.aminePerGram : 0,
  };
}


function rowOf(table: MaterialTable, id: string): TableMaterial | undefined {
  const index = table.indexOf.get(id);
  return index === undefined ? undefined : table.materials[index];
}

/** Copies of the steps (a step temperature knob sets them in place). */
function copySteps(steps: readonly ProcessStep[]): ProcessStep[] {
  const out: ProcessStep[] = [];
  for (const step of steps) out.push({ ...step });
  return out;
}

/**
 * The kernel's plan for `input` with `knobs` varied, or undefined when the kernel does not cover it.
 *
 * @example
 * ```ts
 * const plan = kernelPlan(materialTable(input.materials), input, [{ kind: "waterValue" }]);
 * plan?.n; // the number of components
 * ```
 */
export function kernelPlan(table: MaterialTable, input: FormulationInput, knobs: readonly Knob[]): KernelPlan | undefined {
  if ((input.modifiers && input.modifiers.length > 0) || table.formulaRefusal) return undefined;
  const n = input.components.length;
  const solventRow = input.solvent ? rowOf(table, input.solvent.materialId) : undefined;
  if (input.solvent && (!solventRow || Number.isNaN(solventRow.molarMass) || Number.isNaN(solventRow.perDensity))) return undefined;
  const solventIndex = solventRow ? table.indexOf.get(solventRow.id)! : -1;
  const waterRow = rowOf(table, input.water.materialId);
  if (!waterRow || Number.isNaN(waterRow.perDensity)) return undefined;
  const basis = input.basis;
  if (input.solvent?.mode === "fill" && basis.type === "solidMass") return undefined;
  const plan: KernelPlan = {
    n,
    knobCode: [],
    knobIndex: [],
    leadingWeights: 0,
    weights: zeros(n),
    coef: zeros(n * STRIDE),
    subject: [],
    thermalComponents: [],
    basisType: basis.type,
    solMassGrams: basis.type === "solidsContent" ? basis.solMassGrams : Number.NaN,
    solidsFraction: basis.type === "solidsContent" ? basis.solidsFraction : Number.NaN,
    fixedSolidMass: basis.type === "solidMass" ? basis.grams : Number.NaN,
    bulkDensity: input.measuredBulkDensity ?? (basis.type === "gelBody" ? basis.bulkDensity : Number.NaN),
    catalystRatio: 0,
    catalystGramsPerMol: 0,
    catalyst: undefined,
    solventMode: !input.solvent ? 0 : input.solvent.mode === "fill" ? 2 : 1,
    solventValue: input.solvent?.mode === "molPerNetworkAtom" ? input.solvent.value : Number.NaN,
    solventMolarMass: solventRow ? solventRow.molarMass : Number.NaN,
    solventGramsPerMol: solventRow ? solventRow.molarMass * solventRow.perAssay : Number.NaN,
    solventAssay: solventRow?.material.assay ?? 1,
    solventLine: solventRow ? lineOf(solventRow, table, solventIndex, true, true) : undefined,
    fillLine: solventRow ? lineOf(solventRow, table, solventIndex, true, false) : undefined,
    fillVolume: basis.type === "gelBody",
    fillAmount: basis.type === "gelBody" ? basis.volumeMl : basis.type === "solidsContent" ? basis.solMassGrams : Number.NaN,
    waterRatio: input.water.ratio === "R" ? 0 : input.water.ratio === "h" ? 1 : 2,
    waterValue: input.water.value,
    waterReference: -1,
    countCarried: input.water.countCarried ?? true,
    waterMolarMass: Number.isNaN(waterRow.molarMass) ? WATER_MOLAR_MASS_G_PER_MOL : waterRow.molarMass,
    waterDensity: waterRow.density,
    waterLine: lineOf(waterRow, table, solventIndex, false, false),
    coating: input.coating ? { ...input.coating } : undefined,
    substrate: undefined,
    substrateIndex: Number.NaN,
    steps: copySteps(input.steps),
    marginC: input.marginC ?? DEFAULT_THERMAL_MARGIN_C,
    stepsVary: false,
  };
  if (input.basis.type === "gelBody") {
    // As model.ts solidMassOf: ρ_bulk · V · (1 − s)³, the cube as a product.
    const remaining = 1 - (input.basis.linearShrinkage ?? 0);
    plan.fixedSolidMass = input.basis.bulkDensity * input.basis.volumeMl * (remaining * remaining * remaining);
  }
  const catalyst = input.catalyst;
  if (catalyst && catalyst.molPerNetworkAtom > 0) {
    const row = rowOf(table, catalyst.materialId);
    if (!row || Number.isNaN(row.molarMass) || Number.isNaN(row.perDensity)) return undefined;
    plan.catalystRatio = catalyst.molPerNetworkAtom;
    plan.catalystGramsPerMol = row.molarMass * row.perAssay;
    plan.catalyst = lineOf(row, table, solventIndex, true, true);
  }
  if (input.substrateId !== undefined) {
    const row = rowOf(table, input.substrateId);
    if (!row) return undefined;
    plan.substrate = row.thermal;
    plan.substrateIndex = row.material.refractiveIndex ?? Number.NaN;
  }
  const thermal: number[] = [];
  for (let i = 0; i < n; i++) {
    const component = input.components[i]!;
    const row = rowOf(table, component.materialId);
    if (!row || Number.isNaN(row.perDensity)) return undefined;
    plan.weights[i] = component.weightFraction;
    const line = lineOf(row, table, solventIndex, false, true);
    const data = materialData(row.material);
    const p = row.precursor;
    const c = plan.coef;
    const o = i * STRIDE;
    plan.subject.push(undefined);
    c[o + C_CONVERSION] = Number.NaN;
    let mass: number;
    let active: number;
    if (row.material.kind === "precursor") {
      if (!p || Number.isNaN(row.molarMass)) return undefined;
      c[o + C_MOLES] = row.molPerResidueGram;
      mass = row.molPerResidueGram * row.molarMass * row.perAssay;
      c[o + C_ATOMS] = row.molPerResidueGram * p.networkAtomsPerMolecule;
      c[o + C_GROUPS] = row.molPerResidueGram * p.hydrolysableGroupsPerMolecule;
      c[o + C_WATER] = mass * row.waterMolPerGram + row.molPerResidueGram * row.crystalWater;
      const alcohol = row.alcoholSlot >= 0 ? table.alcohols[row.alcoholSlot]!.molarMass * c[o + C_GROUPS]! : 0;
      c[o + C_VOC] = mass * line.vocPerGram + alcohol;
      c[o + C_PHASE_DENSITY] = p.residueDensity;
      if (p.conversionTemperatureC !== undefined) {
        c[o + C_CONVERSION] = p.conversionTemperatureC;
        thermal.push(i);
      }
      active = mass * data.assayFactor;
    } else {
      if (row.phaseDensityField !== "") return undefined;
      mass = row.perAssay;
      c[o + C_WATER] = mass * row.waterMolPerGram;
      c[o + C_VOC] = mass * line.vocPerGram;
      c[o + C_PHASE_DENSITY] = row.phaseDensity;
      c[o + C_ORGANIC_SPECIFIC] = 1 / row.phaseDensity;
      c[o + C_ORGANIC] = 1;
      plan.subject[i] = row.thermal;
      if (row.thermal) thermal.push(i);
      active = 1;
    }
    c[o + C_MASS] = mass;
    c[o + C_VOLUME] = mass * row.perDensity;
    c[o + C_SOLVENT] = mass * line.solventPerGram;
    c[o + C_COST] = mass * data.pricePerKg;
    c[o + C_EPOXY] = data.curing ? active * data.epoxyPerGram : 0;
    c[o + C_AMINE] = data.curing ? active * data.aminePerGram : 0;
    c[o + C_SPECIFIC] = 1 / c[o + C_PHASE_DENSITY]!;
    c[o + C_SHARE] = row.organicShare;
    c[o + C_OPTICS] = data.lorentzLorenzTerm / c[o + C_PHASE_DENSITY]!;
    if (input.water.ratio === "perPrecursor" && component.materialId === input.water.referenceId && row.material.kind === "precursor") plan.waterReference = i;
  }
  plan.thermalComponents = thermal;
  for (let k = 0; k < knobs.length; k++) {
    const knob = knobs[k]!;
    if (knob.kind === "weightFraction") {
      if (!(knob.component >= 0 && knob.component < n)) return undefined;
      plan.knobCode.push(KNOB_WEIGHT);
      plan.knobIndex.push(knob.component);
    } else if (knob.kind === "waterValue") plan.knobCode.push(KNOB_WATER);
    else if (knob.kind === "solidsFraction") plan.knobCode.push(KNOB_SOLIDS);
    else if (knob.kind === "stepTemperature") {
      if (!(knob.index >= 0 && knob.index < plan.steps.length)) return undefined;
      plan.knobCode.push(KNOB_STEP);
      plan.knobIndex.push(knob.index);
      plan.stepsVary = true;
    } else if (knob.kind === "withdrawalSpeed") plan.knobCode.push(KNOB_SPEED);
    else return undefined;
    if (plan.knobIndex.length < plan.knobCode.length) plan.knobIndex.push(-1);
  }
  while (plan.leadingWeights < plan.knobCode.length && plan.knobCode[plan.leadingWeights] === KNOB_WEIGHT && plan.knobIndex[plan.leadingWeights] === plan.leadingWeights) {
    plan.leadingWeights += 1;
  }
  return plan;
}
