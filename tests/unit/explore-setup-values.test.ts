/**
 * The explorer's setup form: values entered in % become the contract's grid
 * and search (0–1 fractions), come back unchanged from a saved exploration,
 * and every refusal lands at the form field at fault.
 */
import { describe, expect, it } from "vitest";
import { initialSetup } from "@/components/explore/setup-choices";
import { checkSetup, fromSearch, fromVariable, gridFieldOf, searchFieldOf, toGrid, toSearch, type SetupValues } from "@/components/explore/setup-values";
import { referenceMaterials } from "@/data/materials";
import { EXPLORE_MAX_POINTS } from "@/lib/explore/spec";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";

/** The demo visor hard coat HC-3 (db/demo.ts) with the reference materials. */
const hc3: FormulationInput = {
  materials: ["gptms", "teos", "ti-isopropoxide", "acac", "ethanol", "water-di", "hcl-37", "polycarbonate"].map((id) => referenceMaterials.find((m) => m.id === id)!),
  basis: { type: "solidsContent", solMassGrams: 500, solidsFraction: 0.2 },
  components: [
    { materialId: "gptms", weightFraction: 0.7 },
    { materialId: "teos", weightFraction: 0.25 },
    { materialId: "ti-isopropoxide", weightFraction: 0.05 },
  ],
  modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
  water: { materialId: "water-di", ratio: "R", value: 1.5 },
  solvent: { materialId: "ethanol", mode: "fill" },
  catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
  substrateId: "polycarbonate",
  steps: [
    { name: "Hydrolysis, stirred", temperatureC: 25, durationH: 2, stage: "sol" },
    { name: "Thermal cure", temperatureC: 120, durationH: 2, stage: "curing" },
  ],
  marginC: 20,
};

const catalogue: OutputInfo[] = [
  { key: "refractiveIndex", label: "Refractive index of the coat", unit: "" },
  { key: "organicContent", label: "Organic content", unit: "wt%", percent: true },
];

function setup(patch: (v: SetupValues) => void): SetupValues {
  const v = initialSetup(hc3, catalogue);
  patch(v);
  return v;
}

describe("setup values", () => {
  it("turns a titania sweep entered in % into a 0–1 grid and plans its points", () => {
    const v = setup((s) => {
      s.variables[0] = { kind: "weightFraction", materialId: "ti-isopropoxide", index: "0", from: 0, to: 20, step: 2 };
    });
    const grid = toGrid(v);
    expect(grid).toEqual({ kind: "sweep", variables: [{ kind: "weightFraction", materialId: "ti-isopropoxide", from: 0, to: 0.2, step: 0.02 }] });
    const check = checkSetup(v, hc3, catalogue);
    expect(check.issues).toEqual([]);
    // 0, 2, …, 20 %: 11 points.
    expect(check.plan?.count).toBe(11);
  });

  it("keeps a step temperature in °C and the modifier's index", () => {
    const v = setup((s) => {
      s.mode = "map";
      s.variables[0] = { kind: "stepTemperature", materialId: "", index: "1", from: 90, to: 120, step: 5 };
      s.variables[1] = { kind: "modifierRatio", materialId: "", index: "0", from: 0, to: 1, step: 0.25 };
    });
    expect(toGrid(v)).toEqual({
      kind: "sweep",
      variables: [
        { kind: "stepTemperature", index: 1, from: 90, to: 120, step: 5 },
        { kind: "modifierRatio", index: 0, from: 0, to: 1, step: 0.25 },
      ],
    });
    expect(checkSetup(v, hc3, catalogue).plan?.count).toBe(7 * 5);
  });

  it("reads a saved variable back as entered, without binary noise", () => {
    expect(fromVariable({ kind: "weightFraction", materialId: "teos", from: 0.07, to: 0.35, step: 0.07 })).toEqual({
      kind: "weightFraction",
      materialId: "teos",
      index: "0",
      from: 7,
      to: 35,
      step: 7,
    });
  });

  it("converts a limit in wt% to a fraction and back", () => {
    const values = { on: true, constraints: [{ output: "organicContent", min: 60, max: Number.NaN }], thermal: "clear" as const, goal: "closest" as const, output: "refractiveIndex", value: 1.586 };
    const search = toSearch(values, catalogue);
    expect(search).toEqual({ constraints: [{ output: "organicContent", min: 0.6, max: undefined }], thermal: "clear", objective: { goal: "closest", output: "refractiveIndex", value: 1.586 } });
    const back = fromSearch(search, catalogue);
    expect(back.constraints[0]!.min).toBe(60);
    expect(Number.isNaN(back.constraints[0]!.max)).toBe(true);
    expect(back.value).toBe(1.586);
  });

  it("starts the search closest to the substrate's index (polycarbonate 1.586, data/materials.ts)", () => {
    const v = initialSetup(hc3, catalogue);
    expect(v.search).toMatchObject({ on: false, constraints: [], thermal: "clear", goal: "closest", output: "refractiveIndex", value: 1.586 });
  });

  describe("edge cases", () => {
    it("puts a zero step beside the step field", () => {
      const v = setup((s) => {
        s.variables[0] = { kind: "weightFraction", materialId: "teos", index: "0", from: 0, to: 20, step: 0 };
      });
      const check = checkSetup(v, hc3, catalogue);
      expect(check.plan).toBeUndefined();
      expect(check.issues).toContainEqual({ path: "variables.0.step", message: "step must be greater than 0" });
    });

    it("refuses a 10⁷-point map before anything runs and states the cap", () => {
      const v = setup((s) => {
        s.mode = "map";
        s.variables[0] = { kind: "weightFraction", materialId: "teos", index: "0", from: 0, to: 100, step: 0.01 };
        s.variables[1] = { kind: "waterRatio", materialId: "", index: "0", from: 0, to: 1000, step: 1 };
      });
      const check = checkSetup(v, hc3, catalogue);
      expect(check.plan).toBeUndefined();
      expect(check.issues).toHaveLength(1);
      // Two variables together: the message stands with the point count.
      expect(check.issues[0]!.path).toBe("count");
      expect(check.issues[0]!.message).toContain(EXPLORE_MAX_POINTS.toLocaleString("en"));
    });

    it("names an empty number field and an empty figure list", () => {
      const v = setup((s) => {
        s.variables[0]!.to = Number.NaN;
        s.outputs = [];
      });
      const paths = checkSetup(v, hc3, catalogue).issues.map((i) => i.path);
      expect(paths).toContain("variables.0.to");
      expect(paths).toContain("outputs");
    });

    it("asks for a side of a limit and a value to come closest to", () => {
      const v = setup((s) => {
        s.search = { on: true, constraints: [{ output: "organicContent", min: Number.NaN, max: Number.NaN }], thermal: "any", goal: "closest", output: "refractiveIndex", value: Number.NaN };
      });
      const paths = checkSetup(v, hc3, catalogue).issues.map((i) => i.path);
      expect(paths).toContain("search.constraints.0.min");
      expect(paths).toContain("search.value");
    });

    it("maps grid and search paths to form fields", () => {
      expect(gridFieldOf(["variables", 1, "to"], false)).toBe("variables.1.to");
      expect(gridFieldOf(["variables", 0], false)).toBe("variables.0.kind");
      expect(gridFieldOf(["variables"], false)).toBe("count");
      expect(gridFieldOf([], false)).toBe("mode");
      expect(gridFieldOf(["step"], true)).toBe("ternaryStep");
      expect(gridFieldOf(["materialIds", 2], true)).toBe("materialIds.2");
      expect(searchFieldOf(["constraints", 3])).toBe("search.constraints.3.min");
      expect(searchFieldOf(["constraints", 0, "max"])).toBe("search.constraints.0.max");
      expect(searchFieldOf(["objective", "value"])).toBe("search.value");
    });
  });
});
