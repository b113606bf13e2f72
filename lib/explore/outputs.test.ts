import { describe, expect, it } from "vitest";
import { computeFormulation } from "../formulation/compute";
import { figuresFromResult } from "../formulation/numeric/figures";
import { outputCatalogue, outputInfo, outputValue, SCALAR_FIGURE_KEYS } from "./outputs";
import { outputKeySchema } from "./spec";
import { visorCoat } from "./test-fixtures";

const base = visorCoat(0.05);
const figures = figuresFromResult(computeFormulation(base), base.materials);

describe("outputCatalogue", () => {
  const catalogue = outputCatalogue(base);
  const keys = catalogue.map((o) => o.key);

  it("lists every number of NumericFigures (not phases or the thermal status), each once, with a label and a unit", () => {
    const numeric = Object.keys(figures).filter((k) => k !== "phases" && k !== "thermalStatus");
    expect([...SCALAR_FIGURE_KEYS].sort()).toEqual(numeric.sort());
    for (const k of numeric) expect(keys).toContain(k);
    expect(new Set(keys).size).toBe(keys.length);
    for (const o of catalogue) {
      expect(o.label.length).toBeGreaterThan(3);
      expect(typeof o.unit).toBe("string");
      expect(outputKeySchema.safeParse(o.key).success).toBe(true);
    }
    expect(keys).not.toContain("phases");
    expect(keys).not.toContain("thermalStatus");
  });

  it("states units and marks fractions as percent", () => {
    expect(outputInfo("theoreticalDensity", base)).toEqual({ key: "theoreticalDensity", label: "Theoretical density of the dry composite", unit: "g/cm³" });
    expect(outputInfo("dryThicknessNm", base)?.unit).toBe("nm");
    expect(outputInfo("maxAllowedC", base)?.unit).toBe("°C");
    expect(outputInfo("vocGramsPerLitre", base)?.unit).toBe("g/L");
    expect(outputInfo("organicContent", base)).toMatchObject({ unit: "wt%", percent: true });
    expect(outputInfo("organicVolumeFraction", base)).toMatchObject({ unit: "vol%", percent: true });
    expect(outputInfo("refractiveIndex", base)?.percent).toBeUndefined();
  });

  it("adds |index mismatch| and each phase's volume and weight fraction: the components and the bonded ligand", () => {
    expect(keys).toContain("absIndexMismatch");
    for (const id of ["gptms", "teos", "ti-isopropoxide", "acac"]) {
      expect(keys).toContain(`phaseVolumeFraction:${id}`);
      expect(keys).toContain(`phaseWeightFraction:${id}`);
    }
    const teos = base.materials.find((m) => m.id === "teos")!.name;
    const acac = base.materials.find((m) => m.id === "acac")!.name;
    expect(outputInfo("phaseVolumeFraction:teos", base)).toEqual({ key: "phaseVolumeFraction:teos", label: `${teos} residue, volume fraction of the dry composite`, unit: "vol%", percent: true });
    expect(outputInfo("phaseWeightFraction:acac", base)?.label).toBe(`${acac}, bonded ligand, weight fraction of the dry composite`);
    expect(keys).not.toContain("phaseVolumeFraction:ethanol");
  });

  it("knows nothing of a key outside the catalogue", () => {
    expect(outputInfo("phaseVolumeFraction:ethanol", base)).toBeUndefined();
    expect(outputInfo("toString", base)).toBeUndefined();
    expect(outputInfo("nonsense", base)).toBeUndefined();
  });
});

describe("outputValue", () => {
  it("reads a figure, |coat − substrate| and a phase's fractions", () => {
    expect(outputValue(figures, "refractiveIndex")).toBe(figures.refractiveIndex);
    // polycarbonate's n_D 1.586 (data/materials.ts): the hybrid coat lies below it
    expect(outputValue(figures, "absIndexMismatch")).toBeCloseTo(1.586 - figures.refractiveIndex, 12);
    const teos = figures.phases.find((p) => p.materialId === "teos")!;
    expect(outputValue(figures, "phaseVolumeFraction:teos")).toBe(teos.volumeFraction);
    expect(outputValue(figures, "phaseWeightFraction:teos")).toBe(teos.weightFraction);
    // volume fractions of the phases add up to 1
    const total = ["gptms", "teos", "ti-isopropoxide", "acac"].reduce((s, id) => s + outputValue(figures, `phaseVolumeFraction:${id}`), 0);
    expect(total).toBeCloseTo(1, 12);
  });

  it("is NaN for an unknown key or an absent figure, and 0 for a phase absent from the composite", () => {
    expect(outputValue(figures, "nonsense")).toBeNaN();
    expect(outputValue(figures, "phases")).toBeNaN();
    // no bulk density measured: no porosity
    expect(outputValue(figures, "porosity")).toBeNaN();
    expect(outputValue(figures, "phaseVolumeFraction:pdms-silanol")).toBe(0);
  });
});
