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
import type { Knob } from "./knobs";
import type { MaterialTable, TableMaterial } from "./material-table";
import type { ThermalProfile } from "./thermal";

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

/** Knob codes of the kernel (per knob, what it sets). */
export const KNOB_WEIGHT = 0;
export const KNOB_WATER = 1;
export const KNOB_SOLIDS = 2;
export const KNOB_STEP = 3;
export const KNOB_SPEED = 4;

/** Per component coefficients, interleaved in KernelPlan.coef (STRIDE numbers per component), per g of residue. */
export const C_MASS = 0;
export const C_VOLUME = 1;
export const C_ATOMS = 2;
export const C_GROUPS = 3;
export const C_WATER = 4;
export const C_SOLVENT = 5;
export const C_VOC = 6;
export const C_EPOXY = 7;
export const C_AMINE = 8;
/** g × price per kg (NaN without a price, so that the cost comes out NaN: absent). */
export const C_COST = 9;
/** Per unit weight fraction: 1 / ρ_phase, the same for organic phases only, 1 for organic phases, organic share, Lorentz–Lorenz term / ρ. */
export const C_SPECIFIC = 10;
export const C_ORGANIC_SPECIFIC = 11;
export const C_ORGANIC = 12;
export const C_SHARE = 13;
export const C_OPTICS = 14;
export const STRIDE = 15;

/** The structure of one input, resolved; per component arrays are in the input's component order. */
export interface KernelPlan {
  n: number;
  knobCode: Int32Array;
  /** Component or step index per knob (−1 when none). */
  knobIndex: Int32Array;
  weights: Float64Array;
  precursor: Uint8Array;
  /** STRIDE coefficients per component (C_MASS …). */
  coef: Float64Array;
  molesPerResidue: Float64Array;
  phaseDensity: Float64Array;
  organic: Uint8Array;
  /** Thermal subject of a present component (organic phase), or its precursor's conversion temperature. */
  subject: (ThermalProfile | undefined)[];
  conversionC: Float64Array;
  /** Components whose presence changes the thermal verdict. */
  thermalComponents: Int32Array;
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
  const data = coatMaterialData(row.material);
  const carried = row.material.solventId === undefined ? undefined : table.byId.get(row.material.solventId);
  const carriedVolatile = !carried || coatMaterialData(carried).volatile;
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

const f64 = (n: number): Float64Array => new Float64Array(n);

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
  const at = (id: string | undefined): TableMaterial | undefined => (id === undefined ? undefined : table.materials[table.indexOf.get(id) ?? -1]);
  const n = input.components.length;
  const solventRow = input.solvent ? at(input.solvent.materialId) : undefined;
  if (input.solvent && (!solventRow || Number.isNaN(solventRow.molarMass) || Number.isNaN(solventRow.perDensity))) return undefined;
  const solventIndex = solventRow ? table.indexOf.get(solventRow.id)! : -1;
  const waterRow = at(input.water.materialId);
  if (!waterRow || Number.isNaN(waterRow.perDensity)) return undefined;
  const basis = input.basis;
  if (input.solvent?.mode === "fill" && basis.type === "solidMass") return undefined;
  const plan: KernelPlan = {
    n,
    knobCode: new Int32Array(knobs.length),
    knobIndex: new Int32Array(knobs.length).fill(-1),
    weights: f64(n),
    precursor: new Uint8Array(n),
    coef: f64(n * STRIDE),
    molesPerResidue: f64(n),
    phaseDensity: f64(n),
    organic: new Uint8Array(n),
    subject: new Array<ThermalProfile | undefined>(n).fill(undefined),
    conversionC: f64(n).fill(Number.NaN),
    thermalComponents: new Int32Array(0),
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
    steps: input.steps.map((step) => ({ ...step })),
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
    const row = at(catalyst.materialId);
    if (!row || Number.isNaN(row.molarMass) || Number.isNaN(row.perDensity)) return undefined;
    plan.catalystRatio = catalyst.molPerNetworkAtom;
    plan.catalystGramsPerMol = row.molarMass * row.perAssay;
    plan.catalyst = lineOf(row, table, solventIndex, true, true);
  }
  if (input.substrateId !== undefined) {
    const row = at(input.substrateId);
    if (!row) return undefined;
    plan.substrate = row.thermal;
    plan.substrateIndex = row.material.refractiveIndex ?? Number.NaN;
  }
  const thermal: number[] = [];
  for (let i = 0; i < n; i++) {
    const component = input.components[i]!;
    const row = at(component.materialId);
    if (!row || Number.isNaN(row.perDensity)) return undefined;
    plan.weights[i] = component.weightFraction;
    const line = lineOf(row, table, solventIndex, false, true);
    const data = coatMaterialData(row.material);
    const p = row.precursor;
    const c = plan.coef.subarray(i * STRIDE, (i + 1) * STRIDE);
    let mass: number;
    let active: number;
    if (row.material.kind === "precursor") {
      if (!p || Number.isNaN(row.molarMass)) return undefined;
      plan.precursor[i] = 1;
      plan.molesPerResidue[i] = row.molPerResidueGram;
      mass = row.molPerResidueGram * row.molarMass * row.perAssay;
      c[C_ATOMS] = row.molPerResidueGram * p.networkAtomsPerMolecule;
      c[C_GROUPS] = row.molPerResidueGram * p.hydrolysableGroupsPerMolecule;
      c[C_WATER] = mass * row.waterMolPerGram + row.molPerResidueGram * row.crystalWater;
      const alcohol = row.alcoholSlot >= 0 ? table.alcohols[row.alcoholSlot]!.molarMass * c[C_GROUPS]! : 0;
      c[C_VOC] = mass * line.vocPerGram + alcohol;
      plan.phaseDensity[i] = p.residueDensity;
      if (p.conversionTemperatureC !== undefined) {
        plan.conversionC[i] = p.conversionTemperatureC;
        thermal.push(i);
      }
      active = mass * data.assayFactor;
    } else {
      if (row.phaseDensityField !== "") return undefined;
      mass = row.perAssay;
      c[C_WATER] = mass * row.waterMolPerGram;
      c[C_VOC] = mass * line.vocPerGram;
      plan.phaseDensity[i] = row.phaseDensity;
      plan.organic[i] = 1;
      c[C_ORGANIC_SPECIFIC] = 1 / row.phaseDensity;
      c[C_ORGANIC] = 1;
      plan.subject[i] = row.thermal;
      if (row.thermal) thermal.push(i);
      active = 1;
    }
    c[C_MASS] = mass;
    c[C_VOLUME] = mass * row.perDensity;
    c[C_SOLVENT] = mass * line.solventPerGram;
    c[C_COST] = mass * data.pricePerKg;
    c[C_EPOXY] = data.curing ? active * data.epoxyPerGram : 0;
    c[C_AMINE] = data.curing ? active * data.aminePerGram : 0;
    c[C_SPECIFIC] = 1 / plan.phaseDensity[i]!;
    c[C_SHARE] = row.organicShare;
    c[C_OPTICS] = data.lorentzLorenzTerm / plan.phaseDensity[i]!;
    if (input.water.ratio === "perPrecursor" && component.materialId === input.water.referenceId && row.material.kind === "precursor") plan.waterReference = i;
  }
  plan.thermalComponents = Int32Array.from(thermal);
  for (let k = 0; k < knobs.length; k++) {
    const knob = knobs[k]!;
    if (knob.kind === "weightFraction") {
      if (!(knob.component >= 0 && knob.component < n)) return undefined;
      plan.knobCode[k] = KNOB_WEIGHT;
      plan.knobIndex[k] = knob.component;
    } else if (knob.kind === "waterValue") plan.knobCode[k] = KNOB_WATER;
    else if (knob.kind === "solidsFraction") plan.knobCode[k] = KNOB_SOLIDS;
    else if (knob.kind === "stepTemperature") {
      if (!(knob.index >= 0 && knob.index < plan.steps.length)) return undefined;
      plan.knobCode[k] = KNOB_STEP;
      plan.knobIndex[k] = knob.index;
      plan.stepsVary = true;
    } else if (knob.kind === "withdrawalSpeed") plan.knobCode[k] = KNOB_SPEED;
    else return undefined;
  }
  return plan;
}
