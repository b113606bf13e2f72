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
 * Printed figures (median of 15 rounds in which the four take turns, after 3 warm-up rounds):
 * - "numeric path": the whole run above, 10,000 points;
 * - "model only": numericModel.evaluate over the same 10,000 inputs made beforehand (each call
 *   prepares the model for its input, then computes one point);
 * - "bare arithmetic" (scripts/bench-explore-bare.ts): the floor the arithmetic itself costs, a
 *   hand-inlined loop over Float64Arrays extracted once from this formulation, with no input objects,
 *   knobs, dispatch or result objects, writing into one array it reuses. Two yardsticks:
 *   - every figure: the same 32 scalar figures the numeric path returns (core, solvent, thermal limit,
 *     film, optics, VOC, cure, cost) and the checks they need; the ratio on the last line is against it;
 *   - core figures only: 12 of them, the yardstick of the benchmark's first version, printed beside it
 *     so the two can be compared (it leaves out two thirds of what the path computes).
 *   Both are checked against numericModel at every 50th point, every figure they write;
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
import { decimalModel, numericModel, type FormulationInput } from "../lib/formulation";
import { figuresDifference, relativeDifference, SCALAR_FIGURES } from "../lib/formulation/numeric/compare";
import { referenceMaterial } from "../data/materials";
import { CORE, coreArithmetic, extract, type BareGrid } from "./bench-explore-bare";
import { FULL, fullArithmetic } from "./bench-explore-full";
import { makeInput } from "./bench-input";

const WARMUP_ROUNDS = 3;
const ROUNDS = 15;
const SAMPLE_EVERY = 50;

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

const bareGrid: BareGrid = {
  t: extract(base),
  fractions: Float64Array.from(plan.axes[0]!.values),
  ratios: Float64Array.from(plan.axes[1]!.values),
  solMassGrams: (base.basis as Extract<FormulationInput["basis"], { type: "solidsContent" }>).solMassGrams,
  solidsFraction: (base.basis as Extract<FormulationInput["basis"], { type: "solidsContent" }>).solidsFraction,
};
const fractions = bareGrid.fractions;
const ratios = bareGrid.ratios;
const coreOut = new Float64Array(plan.count * CORE);
const fullOut = new Float64Array(plan.count * FULL);
let bareFailed = 0;

const outputs = [...SCALAR_FIGURE_KEYS];
let refused = 0;
const inputs: FormulationInput[] = [];
for (let p = 0; p < plan.count; p++) {
  const input = pointInput(base, plan, p);
  if (!isPointRefusal(input)) inputs.push(input);
}
let sink = 0;
const [path, modelOnly, coreLoop, fullLoop] = timeTogether([
  () => {
    refused = runExplorationSync({ base, plan, outputs, model }).refusals.length;
  },
  () => {
    for (const input of inputs) {
      const outcome = model.evaluate(input);
      if (outcome.ok) sink += outcome.figures.solMassGrams;
    }
  },
  () => coreArithmetic(bareGrid, coreOut),
  () => {
    bareFailed = fullArithmetic(bareGrid, fullOut);
  },
]);
const pathMs = path!.median;
const coreMs = coreLoop!.median;
const bareMs = fullLoop!.median;

// The yardsticks must compute the same figures as the numeric path, or their time means nothing:
// every figure of every 50th point, against numericModel.
let coreCheck = 0;
let fullCheck = 0;
let fullWorst = "";
for (let p = 0; p < plan.count; p += SAMPLE_EVERY) {
  const input = pointInput(base, plan, p);
  if (isPointRefusal(input)) continue;
  const check = model.evaluate(input);
  if (!check.ok) continue;
  for (const [k, key] of [[0, "solMassGrams"], [4, "theoreticalDensity"], [9, "effectiveR"], [8, "denseLinearShrinkage"], [11, "solventAddedGrams"]] as const) {
    coreCheck = Math.max(coreCheck, relativeDifference(coreOut[p * CORE + k]!, check.figures[key]));
  }
  SCALAR_FIGURES.forEach((key, k) => {
    const difference = relativeDifference(fullOut[p * FULL + k]!, check.figures[key]);
    if (difference > fullCheck) {
      fullCheck = difference;
      fullWorst = ` (point ${p}, ${key})`;
    }
  });
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
console.log(
  `bare arithmetic, every figure (${FULL} per point, ${bareFailed} failed checks): ${bareMs.toFixed(2)} ms (${fullLoop!.fastest.toFixed(2)}); agrees with the model to ${fullCheck.toExponential(1)}${fullWorst}`,
);
console.log(
  `bare arithmetic, core figures only (${CORE} per point, the first yardstick): ${coreMs.toFixed(2)} ms (${coreLoop!.fastest.toFixed(2)}), agrees to ${coreCheck.toExponential(1)}; numeric path ${(pathMs / coreMs).toFixed(1)}x that`,
);
console.log(
  `with a modifier (general branch, ${modifiedRefused} refused): ${modifiedMs.toFixed(1)} ms (${Math.min(...modifiedTimes).toFixed(1)}), ${((modifiedMs * 1000) / modifiedPlan.count).toFixed(2)} µs per point`,
);
console.log(`decimal engine vs numeric path: ${sampled} points sampled (every ${SAMPLE_EVERY}th), largest difference at ${worst || "none"}`);
if (!Number.isFinite(sink)) console.log("(unexpected non-finite checksum)");
console.log(
  `explore: ${plan.count} points in ${pathMs.toFixed(1)} ms, ${(pathMs / bareMs).toFixed(1)}x bare arithmetic, max relative difference ${maxDifference.toExponential(2)} vs the decimal engine`,
);
