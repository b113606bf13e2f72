/**
 * The dry composite of one point, plain float64: weight fractions (scaled
 * to 1 like the engine), modifiers (ligand exchange, bonded-ligand phases,
 * ligands burnt out by a step), and per component its recipe line, its phase
 * and its sums — the same equations as compute.ts with composition.ts,
 * precursor.ts, organic.ts and modifiers.ts.
 */
import type { FormulationInput } from "../input-schema";
import { positionOf, type MaterialTable, type TableMaterial, molarMassOfRow, volumeMl } from "./material-table";
import { addLine, addPhase, componentPositions, type PointPhase, type PointState } from "./point-state";
import { refuse } from "./refusal";

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
      addLine(state, row, "precursor", massGrams, volume, moles, residueGrams, massGrams * row.solventFraction);
      addPhase(state, row.id, p.residueFormula, phaseFraction, p.residueDensity, false, row.organicShare);
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
      addLine(state, row, "organic", massGrams, volume, moles, residueGrams, massGrams * row.solventFraction);
      addPhase(state, row.id, undefined, phaseFraction, row.phaseDensity, true, row.organicShare);
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
    addLine(state, plan.row, "modifier", massGrams, volume, moles, 0, massGrams * plan.row.solventFraction);
    state.carriedWaterMol += massGrams * plan.row.waterMolPerGram;
    replaced += moles * data.groupsReplacedPerMolecule;
    const bondedGrams = plan.bonded ? moles * data.bondedMolarMass : 0;
    if (bondedGrams > 0) {
      let phase: PointPhase | undefined;
      for (let k = firstLigand; k < state.phases.length; k += 1) if (state.phases[k]!.materialId === plan.row.id) phase = state.phases[k];
      if (phase) phase.weightFraction += bondedGrams;
      else addPhase(state, plan.row.id, data.bondedFormula, bondedGrams, data.bondedDensity, false, 1);
    }
  }
  // Ligand phases held grams so far: their weight fraction is over the whole dry composite S.
  for (let k = firstLigand; k < state.phases.length; k += 1) state.phases[k]!.weightFraction /= solidMass;
  state.groupMol = groups - replaced;
  return state;
}
