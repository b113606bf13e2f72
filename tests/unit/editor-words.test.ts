import { describe, expect, it } from "vitest";
import { fieldLabel, fieldMessage, isEmptyDraft } from "@/components/formulation/editor-words";
import { formulationInputSchema } from "@/lib/formulation";

// The words are the product's own; no external source.
describe("editor words", () => {
  it("returns the form row a field belongs to", () => {
    expect(fieldLabel("components.0.materialId")).toBe("Component 1");
    expect(fieldLabel("components.2.weightPercent")).toBe("Component 3");
    expect(fieldLabel("steps.1.temperatureC")).toBe("Step 2, temperature");
    expect(fieldLabel("basis.solidsPercent")).toBe("Solids content");
    expect(fieldLabel("water.materialId")).toBe("Water");
  });

  it("returns the engine's message for an empty component as a row and an instruction", () => {
    const parsed = formulationInputSchema.safeParse({
      materials: [],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "", weightFraction: 1 }],
      water: { materialId: "", ratio: "R", value: 4 },
      steps: [],
    });
    const messages = parsed.error?.issues.map((i) => i.message) ?? [];
    expect(messages.join(" | ")).not.toMatch(/material id|materialId/);
    const component = parsed.error?.issues.find((i) => i.path.join(".") === "components.0.materialId");
    expect(fieldMessage("components.0.materialId", component?.message ?? "")).toBe("Component 1: choose a material");
  });

  it("returns a weight fraction message in per cent, as the form asks for it", () => {
    expect(fieldMessage("components.1.weightPercent", "weight fraction must be 0 or between 0.000001 and 1")).toBe(
      "Component 2: enter a weight fraction from 0 to 100 %",
    );
  });

  it("returns the form's own messages with their row, in lower case after the row", () => {
    expect(fieldMessage("components.1.materialId", "choose a material")).toBe("Component 2: choose a material");
    expect(fieldMessage("steps.0.name", "Name the step")).toBe("Step 1, name: name the step");
    expect(fieldMessage("name", "Name the formulation")).toBe("Name the formulation");
  });

  describe("edge cases", () => {
    it("returns a plain instruction instead of a message that names an internal field", () => {
      expect(fieldMessage("basis.grams", "basis.grams must be set")).toBe("Dry solid mass: check this value");
      expect(fieldMessage("steps.0.durationH", "durationH is wrong")).toBe("Step 1, duration: check this value");
    });

    it("keeps numbers with decimals and units such as mL in a message", () => {
      expect(fieldMessage("basis.grams", "dry solid mass (g) must be between 0.001 and 100000")).toBe(
        "Dry solid mass: dry solid mass (g) must be between 0.001 and 100000",
      );
      expect(fieldMessage("basis.volumeMl", "mould volume (mL) must be between 0.001 and 100000")).toBe(
        "Mould volume: mould volume (mL) must be between 0.001 and 100000",
      );
    });

    it("returns true for a draft whose components have no material yet, false once one has", () => {
      expect(isEmptyDraft({ components: [{ materialId: "", weightPercent: 100 }] })).toBe(true);
      expect(isEmptyDraft({ components: [{ materialId: "teos", weightPercent: 100 }] })).toBe(false);
    });
  });
});
