/**
 * The running state of one point of the numeric path: its recipe lines,
 * its phases and its sums, one per model and reset for every point; lines
 * and phases are objects of earlier points filled again in place.
 */
import type { FormulationInput } from "../input-schema";
import type { NumericLine } from "./context";
import { positionOf, type MaterialTable, type TableMaterial } from "./material-table";
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
  /** Line and phase objects of earlier points, filled again in place (lines and phases never leave a point). */
  linePool: NumericLine[];
  phasePool: PointPhase[];
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
    linePool: [],
    phasePool: [],
    positions: new Int32Array(8),
    positionIds: [],
  };
}

/**
 * Adds a recipe line to the point (role, g and mL as supplied, mol, g of residue, g of carried solvent).
 *
 * @example
 * ```ts
 * addLine(state, waterRow, "water", 7.2, 7.21, 0.4, 0, 0);
 * ```
 */
export function addLine(
  state: PointState,
  row: TableMaterial,
  role: NumericLine["role"],
  massGrams: number,
  volumeMl: number,
  moles: number,
  residueGrams: number,
  carriedSolventGrams: number,
): void {
  let line = state.linePool[state.lines.length];
  if (line === undefined) {
    line = { materialId: row.id, role, massGrams, volumeMl, moles, residueGrams, carriedSolventGrams };
    state.linePool.push(line);
  } else {
    line.materialId = row.id;
    line.role = role;
    line.massGrams = massGrams;
    line.volumeMl = volumeMl;
    line.moles = moles;
    line.residueGrams = residueGrams;
    line.carriedSolventGrams = carriedSolventGrams;
  }
  state.lines.push(line);
  state.rows.push(row);
}

/**
 * Adds a phase of the dry composite to the point.
 *
 * @example
 * ```ts
 * addPhase(state, "teos", "SiO2", 0.8, 2.2, false, 0);
 * ```
 */
export function addPhase(state: PointState, materialId: string, residueFormula: string | undefined, weightFraction: number, density: number, organic: boolean, share: number): void {
  let phase = state.phasePool[state.phases.length];
  if (phase === undefined) {
    phase = { materialId, residueFormula, weightFraction, density, organic, share };
    state.phasePool.push(phase);
  } else {
    phase.materialId = materialId;
    phase.residueFormula = residueFormula;
    phase.weightFraction = weightFraction;
    phase.density = density;
    phase.organic = organic;
    phase.share = share;
  }
  state.phases.push(phase);
}

/**
 * Table positions of the components, looked up again only when the component ids change.
 *
 * @example
 * ```ts
 * componentPositions(input, table, state)[0]; // position of the first component in the materials
 * ```
 */
export function componentPositions(input: FormulationInput, table: MaterialTable, state: PointState): Int32Array {
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
