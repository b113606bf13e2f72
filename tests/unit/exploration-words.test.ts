import { describe, expect, it } from "vitest";
import { candidateValuesWords, constraintWords, figureWords, gridWords, objectiveWords, shortNumber, thermalWords, variableWords } from "@/components/explore/exploration-words";
import { gridNames } from "@/db/queries/explorations";
import type { OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";

// The words are the product's own; no external source. Percent = fraction × 100.
const words = (key: string): OutputInfo =>
  ({
    organicWeightFraction: { key, label: "Organic weight fraction", unit: "%", percent: true },
    refractiveIndex: { key, label: "Refractive index", unit: "" },
    vocGramsPerLitre: { key, label: "VOC", unit: "g/L" },
  })[key] ?? { key, label: key, unit: "" };

describe("exploration words", () => {
  it("returns a sweep's axes with ranges in the units people read (weight fractions in %)", () => {
    const lines = gridWords(
      {
        kind: "sweep",
        variables: [
          { kind: "weightFraction", materialId: "tip", from: 0, to: 0.2, step: 0.05 },
          { kind: "stepTemperature", index: 3, from: 80, to: 140, step: 10 },
        ],
      },
      { tip: "Titanium isopropoxide", "step:3": "Thermal cure" },
    );
    expect(lines).toEqual(["Titanium isopropoxide, weight fraction: 0 → 20 % in steps of 5 %", "Thermal cure, temperature: 80 → 140 °C in steps of 10 °C"]);
  });

  it("returns one line for a ternary map, naming the three components", () => {
    expect(gridWords({ kind: "ternary", materialIds: ["a", "b", "c"], step: 0.05 }, { a: "GPTMS", b: "TEOS", c: "Titania" })).toEqual([
      "Ternary map of GPTMS, TEOS and Titania (their shares of the total they have, in steps of 5 %)",
    ]);
  });

  it("returns limits, aim and thermal condition in words", () => {
    expect(constraintWords({ output: "organicWeightFraction", min: 0.6 }, words)).toBe("Organic weight fraction ≥ 60 %");
    expect(constraintWords({ output: "vocGramsPerLitre", max: 420 }, words)).toBe("VOC ≤ 420 g/L");
    expect(constraintWords({ output: "refractiveIndex", min: 1.5, max: 1.6 }, words)).toBe("Refractive index from 1.5 to 1.6");
    expect(objectiveWords({ goal: "closest", output: "refractiveIndex", value: 1.586 }, words)).toBe("refractive index closest to 1.586");
    expect(objectiveWords({ goal: "min", output: "vocGramsPerLitre" }, words)).toBe("lowest VOC");
    expect(objectiveWords({ goal: "max", output: "x" }, () => ({ key: "x", label: "Refractive index of the coat (n_D)", unit: "" }))).toBe("highest refractive index of the coat (n_D)");
    expect(thermalWords({ constraints: [], thermal: "caution", objective: { goal: "max", output: "x" } })).toBe("thermal check clear or caution");
  });

  it("reads names of what varies from the revision's input", () => {
    const input = {
      materials: [{ id: "m1", name: "Acetylacetone" }, { id: "tip", name: "Titanium isopropoxide" }],
      modifiers: [{ materialId: "m1", precursorId: "tip", molPerMetal: 1 }],
      steps: [{ name: "Hydrolysis", temperatureC: 25, durationH: 1 }],
    } as unknown as FormulationInput;
    expect(
      gridNames(
        {
          kind: "sweep",
          variables: [
            { kind: "modifierRatio", index: 0, from: 0.5, to: 2, step: 0.5 },
            { kind: "stepTemperature", index: 0, from: 20, to: 60, step: 10 },
          ],
        },
        input,
      ),
    ).toEqual({ "modifier:0": "Acetylacetone", "step:0": "Hydrolysis" });
    expect(gridNames({ kind: "ternary", materialIds: ["tip", "m1", "gone"], step: 0.1 }, input)).toEqual({ tip: "Titanium isopropoxide", m1: "Acetylacetone", gone: "gone" });
  });

  it("returns a candidate's values with the units of the grid's variables", () => {
    const grid = {
      kind: "sweep" as const,
      variables: [
        { kind: "weightFraction" as const, materialId: "tip", from: 0, to: 0.2, step: 0.05 },
        { kind: "stepTemperature" as const, index: 3, from: 80, to: 140, step: 10 },
      ],
    };
    expect(candidateValuesWords(grid, [0.1, 110])).toBe("10 %, 110 °C");
    expect(candidateValuesWords({ kind: "ternary", materialIds: ["a", "b", "c"], step: 0.1 }, [0.5, 0.3, 0.2])).toBe("50 %, 30 %, 20 %");
  });

  describe("edge cases", () => {
    it("returns a dash for a figure that is not a number, and at most 4 significant digits", () => {
      expect(shortNumber(Number.NaN)).toBe("–");
      expect(shortNumber(1.58634)).toBe("1.586");
      expect(figureWords(0.123456, { unit: "%", percent: true })).toBe("12.35 %");
      expect(variableWords({ kind: "waterRatio", from: 4, to: 1, step: 0.5 }, {})).toBe("Water ratio: 4 → 1 in steps of 0.5");
    });
  });
});
