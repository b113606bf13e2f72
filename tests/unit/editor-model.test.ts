import { describe, expect, it } from "vitest";
import { editorSchema, formFieldFor, inputFromValues, valuesFromInput } from "@/components/formulation/editor-model";
import { fieldMessage } from "@/components/formulation/editor-words";
import { computeFormulation, type FormulationInput } from "@/lib/formulation";
import { referenceMaterial, referenceMaterials } from "@/data/materials";

// The editor's conversion between form values and the engine input; no chemistry is checked here
// beyond "the engine computes it" (the engine's own tests carry the sources).
const record = (id: string) => referenceMaterials.find((m) => m.id === id);
const meta = { name: "Chelated titania hybrid", project: null };

const v2Input: FormulationInput = {
  materials: ["ti-isopropoxide", "gptms", "teos", "acac", "water-di", "ethanol", "hcl-37"].map(referenceMaterial),
  basis: { type: "solidMass", grams: 10 },
  components: [
    { materialId: "ti-isopropoxide", weightFraction: 0.2 },
    { materialId: "gptms", weightFraction: 0.5 },
    { materialId: "teos", weightFraction: 0.3 },
  ],
  modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
  water: { materialId: "water-di", ratio: "perPrecursor", referenceId: "teos", value: 12, countCarried: false },
  solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
  catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
  steps: [
    { name: "Chelation and hydrolysis", temperatureC: 25, durationH: 2, stage: "sol", atmosphere: "air" },
    { name: "Cure", temperatureC: 150, durationH: 1, stage: "curing", atmosphere: "inert" },
  ],
  marginC: 20,
  additionOrder: ["ti-isopropoxide", "acac"],
};

describe("editor model", () => {
  it("keeps modifiers, the water convention, step stage and atmosphere and the addition order through a save", () => {
    const values = valuesFromInput(v2Input, meta);
    expect(values.modifiers).toEqual([{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }]);
    expect(values.water).toMatchObject({ ratio: "perPrecursor", referenceId: "teos", countCarried: false });
    const back = inputFromValues(values, record);
    expect(back.modifiers).toEqual(v2Input.modifiers);
    expect(back.water).toEqual(v2Input.water);
    expect(back.steps).toEqual(v2Input.steps);
    expect(back.additionOrder).toEqual(v2Input.additionOrder);
    expect(back.materials.map((m) => m.id)).toContain("acac");
    const result = computeFormulation(back);
    expect(result.lines.some((l) => l.role === "modifier" && l.materialId === "acac")).toBe(true);
  });

  it("opens a draft stored before engine v2 (no modifiers, no water convention, steps without stage) and saves it unchanged in meaning", () => {
    const old = {
      materials: ["teos", "water-di", "ethanol"].map(referenceMaterial),
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "teos", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      steps: [{ name: "Drying", temperatureC: 60, durationH: 24 }],
    } as FormulationInput;
    const values = valuesFromInput(old, meta);
    expect(values.modifiers).toEqual([]);
    expect(values.water).toMatchObject({ ratio: "R", countCarried: true, referenceId: "" });
    expect(values.steps[0]).toMatchObject({ stage: "curing", atmosphere: "air" });
    const back = inputFromValues(values, record);
    expect(back.modifiers).toBeUndefined();
    expect(back.water).toEqual({ materialId: "water-di", ratio: "R", value: 4 });
    // A stored step without a stage was checked as a cure in air; it is saved as one.
    expect(back.steps[0]).toEqual({ name: "Drying", temperatureC: 60, durationH: 24, stage: "curing", atmosphere: "air" });
    expect(computeFormulation(back).lines.length).toBeGreaterThan(0);
    expect(computeFormulation(old).lines).toEqual(computeFormulation(back).lines);
  });

  it("drops the reference precursor when the ratio is not per precursor", () => {
    const values = valuesFromInput(v2Input, meta);
    values.water.ratio = "R";
    expect(inputFromValues(values, record).water.referenceId).toBeUndefined();
  });

  it("places the engine's modifier messages at the modifier row", () => {
    const values = valuesFromInput(v2Input, meta);
    expect(formFieldFor("modifiers.0.molPerMetal", values, v2Input)).toEqual({ field: "modifiers.0.molPerMetal" });
    expect(formFieldFor("modifiers.0.precursorId", values, v2Input)).toEqual({ field: "modifiers.0.precursorId" });
    expect(formFieldFor("water.referenceId", values, v2Input)).toEqual({ field: "water.referenceId" });
    expect(formFieldFor("steps.1.stage", values, v2Input)).toEqual({ field: "steps.1.stage" });
  });

  it("puts too_much_modifier beside the ratio of the modifier row", () => {
    const values = valuesFromInput(v2Input, meta);
    values.modifiers[0]!.molPerMetal = 5;
    const input = inputFromValues(values, record);
    let path = "";
    try {
      computeFormulation(input);
    } catch (err) {
      path = (err as { issues: { field: string }[] }).issues[0]!.field;
    }
    expect(path).toBe("modifiers.0.molPerMetal");
    expect(formFieldFor(path, values, input).field).toBe("modifiers.0.molPerMetal");
  });

  describe("the coat", () => {
    it("keeps a dip coat with its target and area through a save", () => {
      const coating = { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24, targetDryThicknessNm: 3000, areaM2: 0.5 } as const;
      const values = valuesFromInput({ ...v2Input, coating }, meta);
      expect(values.coating).toMatchObject({ method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24, targetDryThicknessNm: 3000, areaM2: 0.5 });
      expect(inputFromValues(values, record).coating).toEqual(coating);
    });

    it("keeps a spin coat's measured film and a wet film through a save, without target or area when none is set", () => {
      const spin = { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 400 } } as const;
      const sv = valuesFromInput({ ...v2Input, coating: spin }, meta);
      expect(Number.isNaN(sv.coating.targetDryThicknessNm)).toBe(true);
      expect(inputFromValues(sv, record).coating).toEqual(spin);
      const wet = { method: "wetFilm", wetThicknessUm: 12, areaM2: 2 } as const;
      expect(inputFromValues(valuesFromInput({ ...v2Input, coating: wet }, meta), record).coating).toEqual(wet);
    });

    it("sends only the chosen method's inputs, and nothing for method none", () => {
      const values = valuesFromInput({ ...v2Input, coating: { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24 } }, meta);
      values.coating.method = "wetFilm";
      expect(inputFromValues(values, record).coating).toEqual({ method: "wetFilm", wetThicknessUm: 10 });
      // Switching back restores the dip inputs the form kept.
      values.coating.method = "dip";
      expect(inputFromValues(values, record).coating).toMatchObject({ withdrawalMmPerS: 2 });
      values.coating.method = "none";
      expect(inputFromValues(values, record).coating).toBeUndefined();
    });

    it("opens a draft stored without a coat as method none and saves it without one", () => {
      const values = valuesFromInput(v2Input, meta);
      expect(values.coating.method).toBe("none");
      expect("coating" in inputFromValues(values, record)).toBe(false);
    });

    it("places the engine's messages beside the coat's fields, in words", () => {
      const values = valuesFromInput({ ...v2Input, coating: { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 400 } } }, meta);
      values.coating.rpm = 0;
      const input = inputFromValues(values, record);
      let issues: { field: string; message: string }[] = [];
      try {
        computeFormulation(input);
      } catch (err) {
        issues = (err as { issues: { field: string; message: string }[] }).issues;
      }
      expect(issues[0]?.field).toBe("coating.rpm");
      const { field } = formFieldFor(issues[0]!.field, values, input);
      expect(field).toBe("coating.rpm");
      expect(fieldMessage(field, issues[0]!.message)).toMatch(/^Spin speed: spin speed \(rpm\) must be between 1 and/);
      expect(formFieldFor("coating.calibration.dryThicknessNm", values, input)).toEqual({ field: "coating.calibrationDryThicknessNm" });
      expect(formFieldFor("coating.calibration", values, input)).toEqual({ field: "coating.calibrationRpm" });
      expect(formFieldFor("coating", values, input)).toEqual({ field: "coating.method" });
    });

    it("refuses an empty input of the chosen method before saving, and ignores the other methods' empty inputs", () => {
      const values = valuesFromInput({ ...v2Input, coating: { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 3, surfaceTensionMNPerM: 24 } }, meta);
      values.coating.rpm = Number.NaN;
      expect(editorSchema.safeParse(values).success).toBe(true);
      values.coating.viscosityMPaS = Number.NaN;
      const parsed = editorSchema.safeParse(values);
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues.map((i) => i.path.join("."))).toEqual(["coating.viscosityMPaS"]);
    });
  });
});
