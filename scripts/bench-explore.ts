/**
 * Benchmark of the design explorer's numeric path: a 10,000-point map
 * (100 × 100: the first precursor's weight fraction × the water ratio R) of
 * the 10-component formulation of bench-engine (scripts/bench-input.ts),
 * run the way the explorer runs it: runExplorationSync prepares the numeric
 * model once for the plan (lib/formulation/numeric/evaluator.ts), writes each
 * point's varied numbers as knob values (lib/explore/apply.ts), the kernel
 * (lib/formulation/numeric/kernel.ts) computes every figure, core and coat,
 * and every scalar figure is copied into the run's Float64Arrays.
 *
 * Printed figures (median of 9 rounds in which the three take turns, after 3 warm-up rounds):
 * - "numeric path": the whole run above, 10,000 points;
 * - "model only": numericModel.evaluate over the same 10,000 inputs made beforehand (each call
 *   prepares the model for its input, then computes one point);
 * - "bare arithmetic": the floor the arithmetic itself costs. A hand-inlined loop over
 *   Float64Arrays extracted once from this formulation (per component: mol per g residue,
 *   g and mL as supplied per mol, network atoms and alkoxy groups per mol, carried water,
 *   1 / phase density), with no input objects, no maps and no result objects. Per point it
 *   covers the core figures only: the weight fractions (the rest keep their proportions),
 *   precursor and organic amounts, the catalyst, water target and carried water, the ethanol
 *   fill to the 500 g sol with the water still needed, sol mass and volume, solids fraction
 *   and residue per litre, theoretical density, the organic phase's weight and volume
 *   fractions, dense shrinkage (linear and volumetric), effective R and h. It leaves out
 *   what the numeric path also does: refusal checks, the thermal verdict, organic content,
 *   the phase list, solvent figures, and the coat figures (film, optics, VOC, cure, cost);
 * - "with a modifier": the same grid over the same formulation with acetylacetone on one titanium
 *   alkoxide (1 mol/mol), which the kernel does not cover: every point takes the general branch
 *   (the point's input through composition.ts and liquids.ts); median of 5 runs, timed on its own;
 * - the largest relative difference between the numeric path and the decimal engine
 *   (decimalModel) over every 50th point, all figures (lib/formulation/numeric/compare.ts).
 *
 * Run: npm run bench:explore. Targets (not asserted): ≤ 200 ms for the
 * 10,000 points and ≤ 3× the bare arithmetic. The last line is the summary.
 */
import { performance } from "node:perf_hooks";
import { isPlanError, isPointRefusal, planGrid, pointInput, runExplorationSync, SCALAR_FIGURE_KEYS, type Grid, type GridPlan } from "../lib/explore";
import { decimalModel, numericModel, type FormulationInput, type Material } from "../lib/formulation";
import { figuresDifference } from "../lib/formulation/numeric/compare";
import { referenceMaterial } from "../data/materials";
import { makeInput } from "./bench-input";

const WARMUP_ROUNDS = 3;
const ROUNDS = 9;
const SAMPLE_EVERY = 50;
const WATER_MOL_PER_GRAM = 1 / 18.015;

const base = makeInput(10);
const varied = base.components[0]!.materialId;
const grid: Grid = {
  kind: "sweep",
  variables: [
    { kind: "weightFraction", materialId: varied, from: 0.01, to: 0.505, step: 0.005 },
    { kind: "waterRatio", from: 1, to: 5.95, step: 0.05 },
  ],
};
const planned = planGrid(grid, base);
if (isPlanError(planned)) throw new Error(`${planned.field}: ${planned.message}`);
const plan: GridPlan = planned;
const model = numericModel(base.materials);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}

/**
 * Median and fastest time of each function, ms: warm-up rounds, then rounds in which the functions
 * take turns, so that the load of other work on a shared machine falls on all of them alike.
 */
function timeTogether(fns: readonly (() => void)[]): { median: number; fastest: number }[] {
  for (let i = 0; i < WARMUP_ROUNDS; i += 1) for (const fn of fns) fn();
  const times = fns.map(() => [] as number[]);
  for (let i = 0; i < ROUNDS; i += 1) {
    fns.forEach((fn, k) => {
      const start = performance.now();
      fn();
      times[k]!.push(performance.now() - start);
    });
  }
  return times.map((t) => ({ median: median(t), fastest: Math.min(...t) }));
}

/** Per component constants of this formulation, extracted once (what a bare loop would start from). */
function extract(input: FormulationInput) {
  const byId = new Map(input.materials.map((m) => [m.id, m]));
  const n = input.components.length;
  const table = {
    weight: new Float64Array(n),
    isPrecursor: new Uint8Array(n),
    molPerResidueGram: new Float64Array(n),
    gramsPerMol: new Float64Array(n),
    perAssay: new Float64Array(n),
    perDensity: new Float64Array(n),
    atomsPerMol: new Float64Array(n),
    groupsPerMol: new Float64Array(n),
    waterPerGram: new Float64Array(n),
    crystalWater: new Float64Array(n),
    perPhaseDensity: new Float64Array(n),
  };
  input.components.forEach((c, i) => {
    const m = byId.get(c.materialId) as Material;
    const p = m.precursor;
    table.weight[i] = c.weightFraction;
    table.isPrecursor[i] = p ? 1 : 0;
    table.molPerResidueGram[i] = p ? 1 / (p.residuePerMolecule * p.residueMolarMass) : 0;
    table.perAssay[i] = 1 / (m.assay ?? 1);
    table.gramsPerMol[i] = (m.molarMass ?? 0) / (m.assay ?? 1);
    table.perDensity[i] = 1 / m.density!;
    table.atomsPerMol[i] = p?.networkAtomsPerMolecule ?? 0;
    table.groupsPerMol[i] = p?.hydrolysableGroupsPerMolecule ?? 0;
    table.waterPerGram[i] = (m.waterFraction ?? 0) * WATER_MOL_PER_GRAM;
    table.crystalWater[i] = m.crystalWaterPerFormula ?? 0;
    table.perPhaseDensity[i] = 1 / (p ? p.residueDensity : (m.phaseDensity ?? m.density!));
  });
  const catalyst = byId.get(input.catalyst!.materialId)!;
  const water = byId.get(input.water.materialId)!;
  const solvent = byId.get(input.solvent!.materialId)!;
  return {
    ...table,
    n,
    catalystRatio: input.catalyst!.molPerNetworkAtom,
    catalystGramsPerMol: catalyst.molarMass! / (catalyst.assay ?? 1),
    catalystWaterPerGram: (catalyst.waterFraction ?? 0) * WATER_MOL_PER_GRAM,
    catalystPerDensity: 1 / catalyst.density!,
    waterMolarMass: water.molarMass!,
    waterPerDensity: 1 / water.density!,
    solventPerDensity: 1 / solvent.density!,
    solventWaterPerGram: (solvent.waterFraction ?? 0) * WATER_MOL_PER_GRAM,
  };
}

const bare = extract(base);
const fractions = Float64Array.from(plan.axes[0]!.values);
const ratios = Float64Array.from(plan.axes[1]!.values);
const basis = base.basis as Extract<FormulationInput["basis"], { type: "solidsContent" }>;
const CORE = 12;
const bareOut = new Float64Array(plan.count * CORE);

/** The core figures of every point, hand-inlined (see the header). */
function bareArithmetic(): void {
  const t = bare;
  const solidMass = basis.solidsFraction * basis.solMassGrams;
  let othersTotal = 0;
  for (let i = 1; i < t.n; i++) othersTotal += t.weight[i]!;
  let p = 0;
  for (let a = 0; a < fractions.length; a++) {
    const w0 = fractions[a]!;
    const scale = (1 - w0) / othersTotal;
    for (let b = 0; b < ratios.length; b++, p++) {
      let atoms = 0;
      let groups = 0;
      let carried = 0;
      let mass = 0;
      let volume = 0;
      let specificVolume = 0;
      let organicSpecific = 0;
      let organicWeight = 0;
      for (let i = 0; i < t.n; i++) {
        const w = i === 0 ? w0 : t.weight[i]! * scale;
        const residue = w * solidMass;
        let grams: number;
        if (t.isPrecursor[i]) {
          const moles = residue * t.molPerResidueGram[i]!;
          grams = moles * t.gramsPerMol[i]!;
          atoms += moles * t.atomsPerMol[i]!;
          groups += moles * t.groupsPerMol[i]!;
          carried += moles * t.crystalWater[i]!;
        } else {
          grams = residue * t.perAssay[i]!;
          organicSpecific += w * t.perPhaseDensity[i]!;
          organicWeight += w;
        }
        carried += grams * t.waterPerGram[i]!;
        mass += grams;
        volume += grams * t.perDensity[i]!;
        specificVolume += w * t.perPhaseDensity[i]!;
      }
      const catalystGrams = t.catalystRatio * atoms * t.catalystGramsPerMol;
      carried += catalystGrams * t.catalystWaterPerGram;
      mass += catalystGrams;
      volume += catalystGrams * t.catalystPerDensity;
      const need = ratios[b]! * atoms - carried;
      const available = basis.solMassGrams - mass;
      let solvent = available;
      let addWater = 0;
      if (need > 0) {
        solvent = (available - need * t.waterMolarMass) / (1 - t.solventWaterPerGram * t.waterMolarMass);
        addWater = need - solvent * t.solventWaterPerGram;
      }
      const waterGrams = addWater * t.waterMolarMass;
      const solMass = mass + solvent + waterGrams;
      const solVolume = volume + solvent * t.solventPerDensity + waterGrams * t.waterPerDensity;
      const density = 1 / specificVolume;
      const ratio = solidMass / density / solVolume;
      const totalWater = carried + addWater;
      const o = p * CORE;
      bareOut[o] = solMass;
      bareOut[o + 1] = solVolume;
      bareOut[o + 2] = solidMass / solMass;
      bareOut[o + 3] = (solidMass * 1000) / solVolume;
      bareOut[o + 4] = density;
      bareOut[o + 5] = organicWeight;
      bareOut[o + 6] = organicSpecific * density;
      bareOut[o + 7] = 1 - ratio;
      bareOut[o + 8] = 1 - Math.cbrt(ratio);
      bareOut[o + 9] = totalWater / atoms;
      bareOut[o + 10] = totalWater / groups;
      bareOut[o + 11] = solvent;
    }
  }
}

const outputs = [...SCALAR_FIGURE_KEYS];
let refused = 0;
const inputs: FormulationInput[] = [];
for (let p = 0; p < plan.count; p++) {
  const input = pointInput(base, plan, p);
  if (!isPointRefusal(input)) inputs.push(input);
}
let sink = 0;
const [path, modelOnly, bareLoop] = timeTogether([
  () => {
    refused = runExplorationSync({ base, plan, outputs, model }).refusals.length;
  },
  () => {
    for (const input of inputs) {
      const outcome = model.evaluate(input);
      if (outcome.ok) sink += outcome.figures.solMassGrams;
    }
  },
  bareArithmetic,
]);
const pathMs = path!.median;
const bareMs = bareLoop!.median;

// The bare loop must compute the same figures, or its time means nothing.
let bareCheck = 0;
const check = model.evaluate(pointInput(base, plan, 4321) as FormulationInput);
if (check.ok) {
  const o = 4321 * CORE;
  for (const [k, key] of [[0, "solMassGrams"], [4, "theoreticalDensity"], [9, "effectiveR"], [8, "denseLinearShrinkage"]] as const) {
    bareCheck = Math.max(bareCheck, Math.abs(bareOut[o + k]! - check.figures[key]) / Math.abs(check.figures[key]));
  }
}

// The modifier case: same grid, one modifier (the general branch for every point).
const modified: FormulationInput = {
  ...base,
  materials: [...base.materials, referenceMaterial("acac")],
  modifiers: [{ materialId: "acac", precursorId: base.components[3]!.materialId, molPerMetal: 1 }],
};
const modifiedPlan = planGrid(grid, modified);
if (isPlanError(modifiedPlan)) throw new Error(modifiedPlan.message);
const modifiedModel = numericModel(modified.materials);
const modifiedTimes: number[] = [];
let modifiedRefused = 0;
for (let i = 0; i < 7; i++) {
  const start = performance.now();
  modifiedRefused = runExplorationSync({ base: modified, plan: modifiedPlan, outputs, model: modifiedModel }).refusals.length;
  if (i >= 2) modifiedTimes.push(performance.now() - start);
}
const modifiedMs = median(modifiedTimes);

const reference = decimalModel(base.materials);
let maxDifference = 0;
let worst = "";
let sampled = 0;
for (let p = 0; p < plan.count; p += SAMPLE_EVERY) {
  const input = pointInput(base, plan, p);
  if (isPointRefusal(input)) continue;
  const numeric = model.evaluate(input);
  const decimal = reference.evaluate(input);
  sampled += 1;
  if (!numeric.ok || !decimal.ok) {
    if (numeric.ok !== decimal.ok || (!numeric.ok && !decimal.ok && numeric.code !== decimal.code)) {
      maxDifference = Number.POSITIVE_INFINITY;
      worst = `point ${p}: refusals differ`;
    }
    continue;
  }
  const difference = figuresDifference(numeric.figures, decimal.figures);
  if (difference.max > maxDifference) {
    maxDifference = difference.max;
    worst = `point ${p}, ${difference.figure}`;
  }
}

console.log(`grid: ${plan.count} points (${fractions.length} × ${ratios.length}: ${varied} weight fraction × water ratio R), ${base.components.length} components, ${refused} refused`);
console.log(`median (fastest) of ${ROUNDS} rounds, taken in turn after ${WARMUP_ROUNDS} warm-up rounds:`);
console.log(`numeric path (runner, all ${outputs.length} figures): ${pathMs.toFixed(1)} ms (${path!.fastest.toFixed(1)}), ${((pathMs * 1000) / plan.count).toFixed(2)} µs per point`);
console.log(`model only (inputs made beforehand): ${modelOnly!.median.toFixed(1)} ms (${modelOnly!.fastest.toFixed(1)})`);
console.log(`bare arithmetic (core figures, see header): ${bareMs.toFixed(2)} ms (${bareLoop!.fastest.toFixed(2)}); agrees with the model to ${bareCheck.toExponential(1)}`);
console.log(
  `with a modifier (general branch, ${modifiedRefused} refused): ${modifiedMs.toFixed(1)} ms (${Math.min(...modifiedTimes).toFixed(1)}), ${((modifiedMs * 1000) / modifiedPlan.count).toFixed(2)} µs per point`,
);
console.log(`decimal engine vs numeric path: ${sampled} points sampled (every ${SAMPLE_EVERY}th), largest difference at ${worst || "none"}`);
if (!Number.isFinite(sink)) console.log("(unexpected non-finite checksum)");
console.log(
  `explore: ${plan.count} points in ${pathMs.toFixed(1)} ms, ${(pathMs / bareMs).toFixed(1)}x bare arithmetic, max relative difference ${maxDifference.toExponential(2)} vs the decimal engine`,
);
