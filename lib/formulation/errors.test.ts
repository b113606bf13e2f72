import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { FormulationError, isFormulationError } from "./errors";
import type { FormulationInput } from "./input-schema";
import { formulationInputSchema } from "./input-schema";
import type { Material } from "./material-schema";
import { ref } from "./test-support";

function base(): FormulationInput {
  return {
    materials: [ref("teos"), ref("pcl"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
    basis: { type: "solidMass", grams: 10 },
    components: [
      { materialId: "teos", weightFraction: 0.7 },
      { materialId: "pcl", weightFraction: 0.3 },
    ],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    steps: [{ name: "Dry", temperatureC: 40, durationH: 24 }],
  };
}

function thrown(input: unknown): FormulationError {
  try {
    computeFormulation(input as FormulationInput);
  } catch (error) {
    expect(isFormulationError(error)).toBe(true);
    return error as FormulationError;
  }
  throw new Error("expected a FormulationError");
}

function replaceMaterial(input: FormulationInput, id: string, change: (m: Material) => Material): FormulationInput {
  return { ...input, materials: input.materials.map((m) => (m.id === id ? change(m) : m)) };
}

describe("FormulationError", () => {
  it("returns a typed error when the weight fractions do not sum to 1", () => {
    const error = thrown({ ...base(), components: [{ materialId: "teos", weightFraction: 0.65 }, { materialId: "pcl", weightFraction: 0.3 }] });
    expect(error).toBeInstanceOf(FormulationError);
    expect(error.code).toBe("fractions_do_not_sum");
    expect(error.field).toBe("components");
    expect(error.message).toBe("weight fractions sum to 0.95, they must sum to 1 (a sum within 0.5 % of 1 is scaled to 1)");
  });

  it("accepts weight fractions within 1e-6 of 1", () => {
    expect(() =>
      computeFormulation({ ...base(), components: [{ materialId: "teos", weightFraction: 0.7000005 }, { materialId: "pcl", weightFraction: 0.3 }] }),
    ).not.toThrow();
  });

  it("names the density field of a material without one", () => {
    const error = thrown(replaceMaterial(base(), "teos", (m) => ({ ...m, density: undefined })));
    expect(error.code).toBe("missing_density");
    expect(error.field).toBe("materials.0.density");
  });

  it("asks for the dry-phase density of an organic supplied as a solution", () => {
    const input = replaceMaterial(base(), "pcl", (m) => ({ ...m, assay: 0.2, solventFraction: 0.8, phaseDensity: undefined }));
    const error = thrown(input);
    expect(error.code).toBe("missing_density");
    expect(error.field).toBe("materials.1.phaseDensity");
  });

  it("refuses a precursor with no residue data", () => {
    const error = thrown(replaceMaterial(base(), "teos", (m) => ({ ...m, precursor: undefined })));
    expect(error.code).toBe("no_residue");
    expect(error.field).toBe("materials.0.precursor");
  });

  it("refuses a fill with nothing to fill", () => {
    const error = thrown({ ...base(), solvent: { materialId: "ethanol", mode: "fill" } });
    expect(error.code).toBe("nothing_to_fill");
    expect(error.field).toBe("solvent.mode");
  });

  it("refuses a mould too small for its reagents", () => {
    // S = 1.5 × 10 = 15 g SiO2 → TEOS 15 × 208.329 / 60.083 = 52.01 g = 55.7 mL > 10 mL
    const error = thrown({
      ...base(),
      basis: { type: "gelBody", volumeMl: 10, bulkDensity: 1.5 },
      solvent: { materialId: "ethanol", mode: "fill" },
    });
    expect(error.code).toBe("mould_too_small");
    expect(error.field).toBe("basis.volumeMl");
  });

  it("refuses a solids content the reagents cannot reach", () => {
    // x = 0.9: 90 g SiO2 in 100 g sol needs 312 g TEOS
    const error = thrown({
      ...base(),
      basis: { type: "solidsContent", solMassGrams: 100, solidsFraction: 0.9 },
      solvent: { materialId: "ethanol", mode: "fill" },
    });
    expect(error.code).toBe("solids_content_too_high");
    expect(error.field).toBe("basis.solidsFraction");
  });

  it("names an unknown material and a material of the wrong kind", () => {
    const unknown = thrown({ ...base(), water: { materialId: "water-x", ratio: "R", value: 4 } });
    expect(unknown.code).toBe("unknown_material");
    expect(unknown.field).toBe("water.materialId");
    const wrong = thrown({ ...base(), catalyst: { materialId: "ethanol", molPerNetworkAtom: 0.01 } });
    expect(wrong.code).toBe("wrong_kind");
    expect(wrong.field).toBe("catalyst.materialId");
  });

  it("refuses a composition without network-forming atoms", () => {
    const error = thrown({ ...base(), components: [{ materialId: "pcl", weightFraction: 1 }] });
    expect(error.code).toBe("no_network_atoms");
    expect(error.field).toBe("components");
  });

  it("refuses a bulk density above the theoretical density", () => {
    const error = thrown({ ...base(), measuredBulkDensity: 5 });
    expect(error.code).toBe("bulk_density_above_theoretical");
    expect(error.field).toBe("measuredBulkDensity");
  });

  it("returns invalid_input with the first field and every issue", () => {
    const input = { ...base(), basis: { type: "solidMass", grams: -1 }, marginC: Number.NaN };
    const error = thrown(input);
    expect(error.code).toBe("invalid_input");
    expect(error.field).toBe("basis.grams");
    expect(error.message).toBe("dry solid mass (g) must be between 0.000001 and 1000000000");
    expect(error.issues.map((i) => i.field)).toEqual(["basis.grams", "marginC"]);
  });

  it("returns invalid_input for values that are not numbers", () => {
    const error = thrown({ ...base(), components: [{ materialId: "teos", weightFraction: "1" }] });
    expect(error.code).toBe("invalid_input");
    expect(error.field).toBe("components.0.weightFraction");
  });

  describe("edge cases", () => {
    it.each([null, undefined, 42, "x", [], {}])("throws invalid_input for %j", (raw) => {
      const error = thrown(raw);
      expect(error.code).toBe("invalid_input");
    });

    it("lets the shared schema report the same issues to forms", () => {
      const parsed = formulationInputSchema.safeParse({ ...base(), components: [{ materialId: "teos", weightFraction: 0.5 }] });
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues[0]).toMatchObject({
        path: ["components"],
        message: "weight fractions sum to 0.5, they must sum to 1 (a sum within 0.5 % of 1 is scaled to 1)",
        params: { code: "fractions_do_not_sum" },
      });
    });

    it("refuses weight fractions just past 0.5 % from 1 and scales those at exactly 0.5 %, as the decimal sum decides", () => {
      // 0.333 + 0.333 + 0.329 is 0.995 in decimals (0.9950000000000001 in floats): scaled; 0.994999 is refused
      const at = (third: number, others = 0.333): FormulationInput => ({
        ...base(),
        materials: [...base().materials, ref("gptms")],
        components: [
          { materialId: "teos", weightFraction: others },
          { materialId: "pcl", weightFraction: others },
          { materialId: "gptms", weightFraction: third },
        ],
      });
      expect(formulationInputSchema.safeParse(at(0.329)).success).toBe(true);
      expect(computeFormulation(at(0.329)).notices.map((n) => n.code)).toContain("fractions_scaled");
      expect(thrown(at(0.328999)).code).toBe("fractions_do_not_sum");
      expect(thrown(at(0.328999)).message).toContain("weight fractions sum to 0.994999,");
      // 3 × 0.335 is 1.005 in decimals, 1.0050000000000001 in floats: scaled, not refused
      expect(formulationInputSchema.safeParse(at(0.335, 0.335)).success).toBe(true);
      expect(thrown(at(0.335001, 0.335)).code).toBe("fractions_do_not_sum");
    });

    it("refuses a material whose assay, water and solvent fractions add up to more than 1, on its assay", () => {
      const parsed = formulationInputSchema.safeParse({
        ...base(),
        materials: base().materials.map((m) => (m.id === "hcl-37" ? { ...m, assay: 0.5, waterFraction: 0.6 } : m)),
      });
      expect(parsed.error?.issues.map((issue) => [issue.path.join("."), issue.message])).toEqual([
        ["materials.4.assay", "assay + water fraction + solvent fraction is 1.1, it must not exceed 1"],
      ]);
    });
  });
});
