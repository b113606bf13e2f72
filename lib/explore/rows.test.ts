import { describe, expect, it } from "vitest";
import { ENGINE_VERSION } from "../formulation/constants";
import { decimalModel, type NumericModel } from "../formulation/numeric/figures";
import { explorationRows, NUMERIC_PATH_NOTE, refusalWords } from "./rows";
import { planAndRun } from "./run";
import type { Grid, Search } from "./spec";
import { visorCoat } from "./test-fixtures";
import type { ExplorationRun } from "./types";

const base = visorCoat(0.05);
const model = decimalModel(base.materials);
const tiName = base.materials.find((m) => m.id === "ti-isopropoxide")!.name;

function run(grid: Grid, outputs: string[], search?: Search, m: NumericModel = model): ExplorationRun {
  const result = planAndRun({ base, grid, outputs, model: m, search });
  if ("message" in result) throw new Error(result.message);
  return result;
}
const titania: Grid = { kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.05 }] };
const search: Search = {
  constraints: [{ output: "organicContent", min: 0.5 }, { output: "dryThicknessNm", min: 500, max: 900 }],
  thermal: "caution",
  objective: { goal: "closest", output: "refractiveIndex", value: 1.586 },
};

describe("explorationRows", () => {
  it("gives one row per point: the variable in %, each output with its unit, the verdict in words", () => {
    const r = run(titania, ["refractiveIndex", "organicContent", "dryThicknessNm"]);
    const { header, rows } = explorationRows({ formulationName: "Visor hard coat HC-3", revisionLabel: "Revision 2", base, run: r });
    expect(header).toEqual([
      `${tiName}, weight fraction of the dry composite (wt%)`,
      "Refractive index of the coat (n_D)",
      "Organic content of the dry composite (burn-off) (wt%)",
      "Dry film thickness (nm)",
      "Thermal check",
      "Reason refused",
    ]);
    expect(rows).toHaveLength(5);
    expect(rows.map((row) => row[0])).toEqual([0, 5, 10, 15, 20]);
    expect(rows[1]![1]).toBe(r.values[0]![1]);
    expect(rows[1]![2]).toBeCloseTo(r.values[1]![1]! * 100, 12);
    // the demo's 120 °C cure on polycarbonate: caution (its review comment)
    expect(rows[1]![4]).toBe("caution");
    expect(rows[1]![5]).toBeNull();
  });

  it("states the formulation, revision, what varied, the limits, the aim, the engine version and the numeric-path note", () => {
    const r = run(titania, ["refractiveIndex"], search);
    const { about } = explorationRows({ formulationName: "Visor hard coat HC-3", revisionLabel: "Revision 2", explorationName: "Titania for index", base, run: r, search });
    const item = (name: string): unknown[] => about.filter((row) => row[0] === name).map((row) => row[1]);
    expect(item("Exploration")).toEqual(["Titania for index"]);
    expect(item("Formulation")).toEqual(["Visor hard coat HC-3"]);
    expect(item("Revision")).toEqual(["Revision 2"]);
    expect(item("What varied")).toEqual([`${tiName}, weight fraction of the dry composite: 0 to 20 wt% in steps of 5 wt% (5 values)`]);
    expect(item("Points")).toEqual([5]);
    expect(item("Limit")).toEqual(["Organic content of the dry composite (burn-off) ≥ 50 wt%", "Dry film thickness ≥ 500 nm and ≤ 900 nm"]);
    expect(item("Thermal check allowed")).toEqual(["clear or caution"]);
    expect(item("Aim")).toEqual(["Refractive index of the coat (n_D) closest to 1.586"]);
    expect(item("Engine version")).toEqual([ENGINE_VERSION]);
    expect(item("Note")).toEqual([NUMERIC_PATH_NOTE]);
    expect(NUMERIC_PATH_NOTE).toBe("figures from the numeric path; recipes come from the full engine");
  });

  it("writes the engine's reason for a refused point and leaves its figures empty", () => {
    const refusing: NumericModel = { evaluate: (input) => (input.water.value > 2 ? { ok: false, code: "too_much_modifier", field: "modifiers.0.molPerMetal" } : model.evaluate(input)) };
    const r = run({ kind: "sweep", variables: [{ kind: "waterRatio", from: 1, to: 3, step: 1 }] }, ["effectiveR"], undefined, refusing);
    const { header, rows, about } = explorationRows({ formulationName: "F", revisionLabel: "Revision 1", base, run: r });
    expect(header[0]).toBe("Water ratio R (mol water per mol network-forming atom) (mol/mol)");
    expect(rows[2]).toEqual([3, null, "refused by the engine", refusalWords("too_much_modifier", "modifiers.0.molPerMetal")]);
    expect(rows[2]![3]).toContain("more modifier than the precursor has groups to replace");
    expect(about.find((row) => row[0] === "Points refused by the engine")?.[1]).toBe(1);
  });

  it("writes a ternary point's three weight fractions in % and the map in words", () => {
    const r = run({ kind: "ternary", materialIds: ["gptms", "teos", "ti-isopropoxide"], step: 0.5 }, ["theoreticalDensity"]);
    const { header, rows, about } = explorationRows({ formulationName: "F", revisionLabel: "Revision 1", base, run: r });
    expect(header.slice(0, 3)).toEqual(["gptms", "teos", "ti-isopropoxide"].map((id) => `${base.materials.find((m) => m.id === id)!.name}, weight fraction of the dry composite (wt%)`));
    expect(rows[1]!.slice(0, 3)).toEqual([0, 50, 50]);
    expect(String(about.find((row) => row[0] === "What varied")?.[1])).toContain("ternary map of");
  });

  it("writes both variables of a map point", () => {
    const r = run({ kind: "sweep", variables: [{ kind: "solidsContent", from: 0.1, to: 0.3, step: 0.1 }, { kind: "stepTemperature", index: 3, from: 100, to: 120, step: 20 }] }, ["dryThicknessNm"]);
    const { header, rows } = explorationRows({ formulationName: "F", revisionLabel: "Revision 1", base, run: r });
    expect(header.slice(0, 2)).toEqual(["Solids content of the sol (dry composite / sol mass) (wt%)", "Temperature of step 4, Thermal cure (°C)"]);
    expect(rows.map((row) => row.slice(0, 2))).toEqual([[10, 100], [10, 120], [20, 100], [20, 120], [30, 100], [30, 120]]);
    // a dip coat from a sol with more solids is thicker (Landau–Levich: dry thickness ∝ solids content at a fixed viscosity)
    expect(rows[4]![2] as number).toBeGreaterThan(rows[0]![2] as number);
  });
});
