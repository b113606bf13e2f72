import { describe, expect, it } from "vitest";
import { decimalModel, type NumericModel } from "../formulation/numeric/figures";
import { numericModel } from "../formulation/numeric/model";
import { isPlanError, planGrid } from "./grid";
import { runExploration, runExplorationSync } from "./run";
import type { Grid, OutputKey } from "./spec";
import { visorCoat } from "./test-fixtures";
import { POINT_STATUSES, type GridPlan } from "./types";

const base = visorCoat(0.05);
const model = decimalModel(base.materials);

function plan(grid: Grid): GridPlan {
  const result = planGrid(grid, base);
  if (isPlanError(result)) throw new Error(result.message);
  return result;
}
const titaniaSweep = plan({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.02 }] });

describe("runExplorationSync", () => {
  it("keeps one array per output, in order, and a thermal status per point", () => {
    const run = runExplorationSync({ base, plan: titaniaSweep, outputs: ["refractiveIndex", "theoreticalDensity"], model });
    expect(run.outputs).toEqual(["refractiveIndex", "theoreticalDensity"]);
    expect(run.values).toHaveLength(2);
    expect(run.values[0]).toHaveLength(11);
    expect(run.refusals).toEqual([]);
    // the visor coat's 120 °C cure on polycarbonate: within 20 °C of its limit, as the demo's review comment says → not refused
    for (const s of run.status) expect(POINT_STATUSES[s]).not.toBe("refused");
    // the revision itself (titania 0.05 is not a grid value here; 0.04 and 0.06 are) agrees with the engine at 0.06
    const direct = model.evaluate({ ...base, components: [{ materialId: "gptms", weightFraction: 0.94 * (0.7 / 0.95) }, { materialId: "teos", weightFraction: 0.94 * (0.25 / 0.95) }, { materialId: "ti-isopropoxide", weightFraction: 0.06 }] });
    if (!direct.ok) throw new Error(direct.code);
    expect(run.values[0]![3]).toBeCloseTo(direct.figures.refractiveIndex, 12);
  });

  it("raises the coat's refractive index and density with more titania", () => {
    // Lorentz–Lorenz mixing of the phases' indices (chemistry.md, Optics; e.g. Born & Wolf, Principles of Optics, §2.3):
    // TiO2 (n 1.95, anatase-like sol-gel titania) above silica (1.4585) and the GPTMS residue (1.49), so each step
    // of titania replacing both raises n; rutile/anatase (≈ 3.9 g/cm³) is denser than silica (2.2), so ρ rises too.
    const run = runExplorationSync({ base, plan: titaniaSweep, outputs: ["refractiveIndex", "theoreticalDensity"], model });
    const n = [...run.values[0]!];
    const rho = [...run.values[1]!];
    for (let i = 1; i < n.length; i++) {
      expect(n[i]!).toBeGreaterThan(n[i - 1]!);
      expect(rho[i]!).toBeGreaterThan(rho[i - 1]!);
    }
    // between the lowest and the highest phase index, as any Lorentz–Lorenz mix must be
    expect(n[0]!).toBeGreaterThan(1.4585);
    expect(n[10]!).toBeLessThan(1.95);
  });

  it("marks points the engine refuses, with its code and field, and leaves their figures NaN", () => {
    const refusing: NumericModel = {
      evaluate: (input) => (input.water.value > 2 ? { ok: false, code: "solids_content_too_high", field: "basis.solidsFraction" } : model.evaluate(input)),
    };
    const p = plan({ kind: "sweep", variables: [{ kind: "waterRatio", from: 1, to: 3, step: 1 }] });
    const run = runExplorationSync({ base, plan: p, outputs: ["effectiveR"], model: refusing });
    // the revision's 120 °C cure is a caution on polycarbonate (the demo's review comment), at any water ratio
    expect([...run.status].map((s) => POINT_STATUSES[s])).toEqual(["caution", "caution", "refused"]);
    expect(run.refusals).toEqual([{ point: 2, code: "solids_content_too_high", field: "basis.solidsFraction" }]);
    expect(run.values[0]![0]).toBeCloseTo(1, 12);
    expect(Number.isNaN(run.values[0]![2])).toBe(true);
  });

  it("writes NaN into every column at refused points on the prepared numeric path, whatever the outputs", () => {
    // two weight-fraction axes: where GPTMS + TEOS exceed 1 the point is refused (fractions_over_one) before
    // the model runs; the columns are made without a NaN fill on this path, so each refused point must be written
    const p = plan({
      kind: "sweep",
      variables: [
        { kind: "weightFraction", materialId: "gptms", from: 0.5, to: 0.9, step: 0.2 },
        { kind: "weightFraction", materialId: "teos", from: 0.1, to: 0.5, step: 0.2 },
      ],
    });
    const fast = numericModel(base.materials);
    for (const outputs of [["refractiveIndex", "solMassGrams"], ["refractiveIndex", "phaseVolumeFraction:teos", "absIndexMismatch"]] as OutputKey[][]) {
      const run = runExplorationSync({ base, plan: p, outputs, model: fast });
      const refused = new Set(run.refusals.map((r) => r.point));
      // 0.7 + 0.5, 0.9 + 0.3 and 0.9 + 0.5 exceed 1
      expect([...refused].sort()).toEqual([5, 7, 8]);
      for (const r of run.refusals) expect(r).toMatchObject({ code: "fractions_over_one", field: "components" });
      for (let point = 0; point < p.count; point++) {
        for (const column of run.values) expect(Number.isNaN(column[point]!)).toBe(refused.has(point));
      }
    }
  });

  it("computes the figures a search needs even when they are not shown, and lists candidates", () => {
    const run = runExplorationSync({
      base,
      plan: titaniaSweep,
      outputs: ["theoreticalDensity"],
      model,
      search: { constraints: [{ output: "organicContent", min: 0.3 }], thermal: "caution", objective: { goal: "max", output: "refractiveIndex" } },
    });
    expect(run.outputs).toEqual(["theoreticalDensity", "organicContent", "refractiveIndex"]);
    expect(run.candidates?.[0]?.point).toBe(10);
  });
});

describe("film thickness along a withdrawal-speed sweep", () => {
  it("grows as U^(2/3) (Landau–Levich, Acta Physicochim. URSS 17 (1942) 42)", () => {
    // h_wet = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)); the sol is the same at every speed, so h(4)/h(1) = 4^(2/3)
    const p = plan({ kind: "sweep", variables: [{ kind: "withdrawalSpeed", from: 1, to: 4, step: 3 }] });
    const run = runExplorationSync({ base, plan: p, outputs: ["wetThicknessUm", "dryThicknessNm"], model });
    expect(run.values[0]![1]! / run.values[0]![0]!).toBeCloseTo(4 ** (2 / 3), 10);
    expect(run.values[1]![1]! / run.values[1]![0]!).toBeCloseTo(4 ** (2 / 3), 10);
  });
});

describe("thermal verdicts along a cure-temperature sweep", () => {
  it("never gets better as the cure gets hotter, and is clear well below the substrate's limit", () => {
    // A hotter cure of the same coat on the same substrate is never safer (common practice, no source).
    const p = plan({ kind: "sweep", variables: [{ kind: "stepTemperature", index: 3, from: 60, to: 160, step: 10 }] });
    const run = runExplorationSync({ base, plan: p, outputs: ["maxAllowedC"], model });
    for (let i = 1; i < run.status.length; i++) expect(run.status[i]!).toBeGreaterThanOrEqual(run.status[i - 1]!);
    expect(POINT_STATUSES[run.status[0]!]).toBe("clear");
    // 160 °C is above polycarbonate's glass transition (147 °C in data/materials.ts; ≈ 145–150 °C in polymer handbooks, from memory): it fails
    expect(POINT_STATUSES[run.status[10]!]).toBe("fail");
  });
});

describe("runExploration", () => {
  it("reports progress by chunks and gives the same run as the synchronous form", async () => {
    const progress: [number, number][] = [];
    const run = await runExploration({ base, plan: titaniaSweep, outputs: ["refractiveIndex"], model, chunk: 4, onProgress: (d, t) => progress.push([d, t]) });
    expect(progress).toEqual([
      [4, 11],
      [8, 11],
      [11, 11],
    ]);
    const sync = runExplorationSync({ base, plan: titaniaSweep, outputs: ["refractiveIndex"], model });
    expect([...run.values[0]!]).toEqual([...sync.values[0]!]);
    expect([...run.status]).toEqual([...sync.status]);
  });

  it("stops between chunks when cancelled, rejecting with an AbortError", async () => {
    const controller = new AbortController();
    let evaluated = 0;
    const counting: NumericModel = { evaluate: (input) => (evaluated++, model.evaluate(input)) };
    const promise = runExploration({
      base,
      plan: titaniaSweep,
      outputs: ["refractiveIndex"],
      model: counting,
      chunk: 2,
      signal: controller.signal,
      onProgress: (done) => {
        if (done === 4) controller.abort();
      },
    });
    await expect(promise).rejects.toMatchObject({ name: "AbortError" });
    expect(evaluated).toBe(4);
  });

  it("yields to the event loop between chunks, so a message (a cancel) can arrive mid-run", async () => {
    const controller = new AbortController();
    let evaluated = 0;
    // each point takes at least 2 ms, 60 points at least 120 ms: a timer set for 0 ms fires long before the end
    const slow: NumericModel = {
      evaluate: (input) => {
        evaluated++;
        const until = performance.now() + 2;
        while (performance.now() < until);
        return model.evaluate(input);
      },
    };
    const long = plan({ kind: "sweep", variables: [{ kind: "waterRatio", from: 0.5, to: 6.4, step: 0.1 }] });
    expect(long.count).toBe(60);
    setTimeout(() => controller.abort(), 0);
    await expect(runExploration({ base, plan: long, outputs: ["effectiveR"], model: slow, chunk: 1, signal: controller.signal })).rejects.toMatchObject({ name: "AbortError" });
    expect(evaluated).toBeGreaterThan(0);
    expect(evaluated).toBeLessThan(60);
  });

  it("rejects at once when already aborted", async () => {
    const controller = new AbortController();
    controller.abort();
    await expect(runExploration({ base, plan: titaniaSweep, outputs: ["refractiveIndex"], model, signal: controller.signal })).rejects.toMatchObject({ name: "AbortError" });
  });
});
