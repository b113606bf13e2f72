/**
 * The dry composite of one point, plain float64: weight fractions (scaled
 * to 1 like the engine), modifiers (ligand exchange, bonded-ligand phases,
 * ligands burnt out by a step), and per component its recipe line, its phase
 * and its sums — the same equations as compute.ts with composition.ts,
 * precursor.ts, organic.ts and modifiers.ts.
 */
import type { FormulationInput } from "../input-schema";
import { positionOf, type MaterialTable, type TableMaterial, molarMassOfRow, volumeMl } from "./material-table";
import type { NumericLine } from "./context";
import { refuse } from "./refusal";
import type { ThermalProfile } from "./thermal";

/** One phase of the dry composite with what the figures need besides the coat context's fields. */
export interface PointPhase {
  materialId: string;
  residueFormula?: string;
  weightFraction: number;
  /** g/cm³ */
  density: number;
  /** An organic component's phase (not a residue, not a ligand). */
  organic: boolean;
  /** Organic share of the phase (figures.ts organicShares). */
  share: number;
}

/**
 * The running state of one point: lines, phases and the sums the water, solvent and sol figures start
 * from. One per model, reset for every point (a model evaluates one point at a time), so that a point
 * allocates only its lines and phases.
 */
export interface PointState {
  lines: NumericLine[];
  /** The table row of each line (same order as lines). */
  rows: TableMaterial[];
  phases: PointPhase[];
  subjects: ThermalProfile[];
  conversionsC: number[];
  /** mol of alcohol released per distinct alcohol (table.alcohols), and the slots in order of first release. */
  alcoholMol: Float64Array;
  alcoholOrder: number[];
  /** S, g */
  solidMass: number;
  /** Σa, mol */
  networkAtomMol: number;
  /** Σg', mol, after ligand exchange */
  groupMol: number;
  carriedWaterMol: number;
  /** Per table position: mol of precursor molecules and of network atoms (NaN when not a component). */
  precursorMoles: Float64Array;
  precursorAtoms: Float64Array;
  /** Scratch: the table position of each component, and the component ids they were found for. */
  positions: Int32Array;
  positionIds: string[];
}

/**
 * A fresh state for a model over `table`.
 *
 * @example
 * ```ts
 * const state = pointState(table);
 * composePoint(input, table, 10, state);
 * ```
 */
export function pointState(table: MaterialTable): PointState {
  const count = table.materials.length;
  return {
    lines: [],
    rows: [],
    phases: [],
    subjects: [],
    conversionsC: [],
    alcoholMol: new Float64Array(table.alcohols.length),
    alcoholOrder: [],
    solidMass: 0,
    networkAtomMol: 0,
    groupMol: 0,
    carriedWaterMol: 0,
    precursorMoles: new Float64Array(count),
    precursorAtoms: new Float64Array(count),
    positions: new Int32Array(8),
    positionIds: [],
  };
}

/** Table positions of the components, looked up again only when the component ids change. */
function componentPositions(input: FormulationInput, table: MaterialTable, state: PointState): Int32Array {
  const components = input.components;
  const n = components.length;
  let same = state.positionIds.length === n;
  for (let i = 0; same && i < n; i += 1) same = state.positionIds[i] === components[i]!.materialId;
  if (same) return state.positions;
  if (state.positions.length < n) state.positions = new Int32Array(n);
  state.positionIds.length = 0;
  for (let i = 0; i < n; i += 1) {
    state.positions[i] = positionOf(table, components[i]!.materialId, `components.${i}.materialId`);
    state.positionIds.push(components[i]!.materialId);
  }
  return state.positions;
}

const NO_PLANS: readonly Plan[] = [];

interface Plan {
  row: TableMaterial;
  index: number;
  precursorIndex: number;
  x: number;
  bonded: boolean;
}

function planModifiers(input: FormulationInput, table: MaterialTable): Plan[] {
  const specs = input.modifiers ?? [];
  const plans: Plan[] = [];
  for (let i = 0; i < specs.length; i += 1) {
    const spec = specs[i]!;
    const row = table.materials[positionOf(table, spec.materialId, `modifiers.${i}.materialId`)]!;
    const precursorIndex = positionOf(table, spec.precursorId, `modifiers.${i}.precursorId`);
    const data = row.material.modifier;
    if (!data || !table.materials[precursorIndex]!.precursor) refuse("invalid_input", `modifiers.${i}.materialId`);
    const removal = data.removalTemperatureC;
    const burnt = removal !== undefined && input.steps.some((step) => step.temperatureC >= removal);
    plans.push({ row, index: i, precursorIndex, x: spec.molPerMetal, bonded: !burnt });
  }
  // Σ x · q per precursor may not pass its groups per metal atom (checkModifierLoad).
  for (const plan of plans) {
    let total = 0;
    for (const other of plans) {
      if (other.precursorIndex === plan.precursorIndex) total += other.x * other.row.material.modifier!.groupsReplacedPerMolecule;
      if (other === plan) break;
    }
    const p = table.materials[plan.precursorIndex]!.precursor!;
    const perMetal = p.hydrolysableGroupsPerMolecule / (p.networkAtomsPerMolecule > 0 ? p.networkAtomsPerMolecule : 1);
    if (total > perMetal * (1 + 1e-12)) refuse("too_much_modifier", `modifiers.${plan.index}.molPerMetal`);
  }
  return plans;
}

/**
 * Lines, phases and sums of the components and modifiers of one point.
 *
 * @param input - a valid input
 * @param table - the model's materials
 * @param solidMass - S, g (from the basis)
 * @param state - the model's state, reset here
 * @returns the state, after the components and modifiers
 * @example
 * ```ts
 * composePoint(input, table, 10, pointState(table)).networkAtomMol; // 10 / 60.083 mol Si for 10 g of silica from TEOS
 * ```
 */
export function composePoint(input: FormulationInput, table: MaterialTable, solidMass: number, state: PointState): PointState {
  const components = input.components;
  const n = components.length;
  let floatSum = 0;
  for (let i = 0; i < n; i += 1) floatSum += components[i]!.weightFraction;
  const exact = Math.abs(floatSum - 1) <= 1e-12;
  // Within 1e-12 of 1 the fractions are used as they are, else scaled to sum to 1 (as compute.ts does).
  const positions = componentPositions(input, table, state);

  const plans = input.modifiers && input.modifiers.length > 0 ? planModifiers(input, table) : NO_PLANS;
  // c = Σ Δm / S_free over the bonded ligands; S_free = S / (1 + c).
  let c = 0;
  for (const plan of plans) {
    if (!plan.bonded) continue;
    const p = table.materials[plan.precursorIndex]!.precursor!;
    let w = 0;
    for (let i = 0; i < n; i += 1) if (positions[i] === plan.precursorIndex) w = exact ? components[i]!.weightFraction : components[i]!.weightFraction / floatSum;
    c += plan.x * (p.networkAtomsPerMolecule / (p.residuePerMolecule * p.residueMolarMass)) * w * plan.row.material.modifier!.bondedMolarMass;
  }
  const freeMass = c === 0 ? solidMass : solidMass / (c + 1);
  const share = c === 0 ? 1 : freeMass / solidMass;

  state.lines.length = 0;
  state.rows.length = 0;
  state.phases.length = 0;
  state.subjects.length = 0;
  state.conversionsC.length = 0;
  state.alcoholMol.fill(0);
  state.alcoholOrder.length = 0;
  state.solidMass = solidMass;
  state.networkAtomMol = 0;
  state.groupMol = 0;
  state.carriedWaterMol = 0;
  state.precursorMoles.fill(Number.NaN);
  state.precursorAtoms.fill(Number.NaN);
  let groups = 0;
  for (let i = 0; i < n; i += 1) {
    const position = positions[i]!;
    const row = table.materials[position]!;
    const w = exact ? components[i]!.weightFraction : components[i]!.weightFraction / floatSum;
    const phaseFraction = c === 0 ? w : w * share;
    const present = w !== 0;
    const residueGrams = w * freeMass;
    if (row.material.kind === "precursor") {
      const p = row.precursor;
      if (!p) refuse("no_residue", `${row.path}.precursor`);
      const molarMass = molarMassOfRow(row);
      const moles = residueGrams * row.molPerResidueGram;
      const massGrams = moles * molarMass * row.perAssay;
      const hydrolysable = moles * p.hydrolysableGroupsPerMolecule;
      const atoms = moles * p.networkAtomsPerMolecule;
      const carriedWater = massGrams * row.waterMolPerGram + moles * row.crystalWater;
      const volume = volumeMl(row, massGrams);
      state.lines.push({ materialId: row.id, role: "precursor", massGrams, volumeMl: volume, moles, residueGrams, carriedSolventGrams: massGrams * row.solventFraction });
      state.rows.push(row);
      state.phases.push({ materialId: row.id, residueFormula: p.residueFormula, weightFraction: phaseFraction, density: p.residueDensity, organic: false, share: row.organicShare });
      state.networkAtomMol += atoms;
      groups += hydrolysable;
      state.carriedWaterMol += carriedWater;
      state.precursorMoles[position] = moles;
      state.precursorAtoms[position] = atoms;
      if (present && row.alcoholSlot >= 0 && hydrolysable !== 0) {
        const before = state.alcoholMol[row.alcoholSlot]!;
        if (before === 0) state.alcoholOrder.push(row.alcoholSlot);
        state.alcoholMol[row.alcoholSlot] = before + hydrolysable;
      }
      if (present && p.conversionTemperatureC !== undefined) state.conversionsC.push(p.conversionTemperatureC);
    } else {
      const massGrams = residueGrams * row.perAssay;
      const volume = volumeMl(row, massGrams);
      if (row.phaseDensityField !== "") refuse("missing_density", row.phaseDensityField);
      const moles = Number.isNaN(row.molarMass) ? 0 : residueGrams / row.molarMass;
      state.lines.push({ materialId: row.id, role: "organic", massGrams, volumeMl: volume, moles, residueGrams, carriedSolventGrams: massGrams * row.solventFraction });
      state.rows.push(row);
      state.phases.push({ materialId: row.id, weightFraction: phaseFraction, density: row.phaseDensity, organic: true, share: row.organicShare });
      state.carriedWaterMol += massGrams * row.waterMolPerGram;
      if (present && row.thermal) state.subjects.push(row.thermal);
    }
  }
  if (!(state.networkAtomMol > 0)) refuse("no_network_atoms", "components");

  // Modifier lines, their exchanged groups and their bonded-ligand phases (one phase per modifier material).
  let replaced = 0;
  const firstLigand = state.phases.length;
  for (const plan of plans) {
    const atoms = state.precursorAtoms[plan.precursorIndex]!;
    const moles = plan.x * (Number.isNaN(atoms) ? 0 : atoms);
    const data = plan.row.material.modifier!;
    const massGrams = moles * molarMassOfRow(plan.row) * plan.row.perAssay;
    const volume = volumeMl(plan.row, massGrams);
    state.lines.push({ materialId: plan.row.id, role: "modifier", massGrams, volumeMl: volume, moles, residueGrams: 0, carriedSolventGrams: massGrams * plan.row.solventFraction });
    state.rows.push(plan.row);
    state.carriedWaterMol += massGrams * plan.row.waterMolPerGram;
    replaced += moles * data.groupsReplacedPerMolecule;
    const bondedGrams = plan.bonded ? moles * data.bondedMolarMass : 0;
    if (bondedGrams > 0) {
      let phase: PointPhase | undefined;
      for (let k = firstLigand; k < state.phases.length; k += 1) if (state.phases[k]!.materialId === plan.row.id) phase = state.phases[k];
      if (phase) phase.weightFraction += bondedGrams;
      else state.phases.push({ materialId: plan.row.id, residueFormula: data.bondedFormula, weightFraction: bondedGrams, density: data.bondedDensity, organic: false, share: 1 });
    }
  }
  // Ligand phases held grams so far: their weight fraction is over the whole dry composite S.
  for (let k = firstLigand; k < state.phases.length; k += 1) state.phases[k]!.weightFraction /= solidMass;
  state.groupMol = groups - replaced;
  return state;
}
