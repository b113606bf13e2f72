/**
 * Benchmark of the formulation engine: median time per computeFormulation
 * call (validation included) for 2, 10 and 50 components, beside the same
 * core arithmetic done with plain JS numbers (no validation, no decimal.js),
 * as a ratio.
 *
 * Run: npm run bench:engine
 * Target: ≤ 0.2 ms per call for 10 components.
 */
import { performance } from "node:perf_hooks";
import { computeFormulation, type FormulationInput, type Material } from "../lib/formulation";
import { makeInput } from "./bench-input";

const TARGET_MS_AT_10 = 0.2;
const WARMUP_CALLS = 500;
/** Calls per round; the figure reported is the lowest of the rounds' medians, to damp the effect of other load on the machine. */
const CALLS_PER_ROUND = 2000;
const ROUNDS = 5;

/**
 * The same core arithmetic with plain numbers: per-component amounts, water
 * balance, solvent fill by mass, sol totals, volume fractions and
 * theoretical density. A reference for the cost of validation and decimals.
 */
function plainNumbers(input: FormulationInput): number {
  const byId = new Map(input.materials.map((material) => [material.id, material]));
  const basis = input.basis;
  const solidMass = basis.type === "solidsContent" ? basis.solidsFraction * basis.solMassGrams : 1;
  let atoms = 0;
  let groups = 0;
  let carried = 0;
  let mass = 0;
  let volume = 0;
  let specificVolume = 0;
  for (const component of input.components) {
    const m = byId.get(component.materialId) as Material;
    const residue = component.weightFraction * solidMass;
    if (m.precursor) {
      const moles = residue / (m.precursor.residuePerMolecule * m.precursor.residueMolarMass);
      const asSupplied = (moles * (m.molarMass ?? 1)) / (m.assay ?? 1);
      atoms += moles * m.precursor.networkAtomsPerMolecule;
      groups += moles * m.precursor.hydrolysableGroupsPerMolecule;
      carried += (asSupplied * (m.waterFraction ?? 0)) / 18.015 + moles * (m.crystalWaterPerFormula ?? 0);
      mass += asSupplied;
      volume += asSupplied / (m.density ?? 1);
      specificVolume += component.weightFraction / m.precursor.residueDensity;
    } else {
      const asSupplied = residue / (m.assay ?? 1);
      carried += (asSupplied * (m.waterFraction ?? 0)) / 18.015;
      mass += asSupplied;
      volume += asSupplied / (m.density ?? 1);
      specificVolume += component.weightFraction / (m.phaseDensity ?? m.density ?? 1);
    }
  }
  const catalyst = byId.get(input.catalyst?.materialId ?? "") as Material;
  const catalystMass = ((input.catalyst?.molPerNetworkAtom ?? 0) * atoms * (catalyst.molarMass ?? 1)) / (catalyst.assay ?? 1);
  carried += (catalystMass * (catalyst.waterFraction ?? 0)) / 18.015;
  mass += catalystMass;
  const target = input.water.value * (input.water.ratio === "R" ? atoms : groups);
  const addGrams = Math.max(target - carried, 0) * 18.015;
  const solventGrams = (basis.type === "solidsContent" ? basis.solMassGrams : mass) - mass - addGrams;
  const theoreticalDensity = 1 / specificVolume;
  return solventGrams + volume + theoreticalDensity + groups;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1
    ? (sorted[middle] as number)
    : ((sorted[middle - 1] as number) + (sorted[middle] as number)) / 2;
}

function medianMs(fn: () => unknown): number {
  for (let i = 0; i < WARMUP_CALLS; i += 1) fn();
  let best = Number.POSITIVE_INFINITY;
  for (let round = 0; round < ROUNDS; round += 1) {
    const times: number[] = [];
    for (let i = 0; i < CALLS_PER_ROUND; i += 1) {
      const start = performance.now();
      fn();
      times.push(performance.now() - start);
    }
    best = Math.min(best, median(times));
  }
  return best;
}

let sink = 0;
console.log(`median time per call (lowest of ${ROUNDS} rounds of ${CALLS_PER_ROUND} calls)`);
console.log("components  engine ms/call  plain-number ms/call  ratio");
let atTen = Number.NaN;
for (const n of [2, 10, 50]) {
  const input = makeInput(n);
  const engine = medianMs(() => {
    sink += computeFormulation(input).sol.massGrams;
  });
  const plain = medianMs(() => {
    sink += plainNumbers(input);
  });
  if (n === 10) atTen = engine;
  console.log(
    `${String(n).padStart(10)}  ${engine.toFixed(4).padStart(14)}  ${plain.toFixed(5).padStart(20)}  ${(engine / plain).toFixed(0).padStart(5)}×`,
  );
}
console.log(
  `10 components: ${atTen.toFixed(4)} ms per call, target ≤ ${TARGET_MS_AT_10} ms: ${atTen <= TARGET_MS_AT_10 ? "met" : "NOT met"}`,
);
if (!Number.isFinite(sink)) console.log("(unexpected non-finite checksum)");
