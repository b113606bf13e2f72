import { describe, expect, it } from "vitest";
import { diffRevisions } from "@/lib/diff";
import { referenceMaterial } from "@/data/materials";
import type { FormulationInput } from "@/lib/formulation";
import type { Specification } from "@/lib/quality/specification";
import { VISCOSITY_SPEC } from "../helpers/specifications";

// Which specification changes a revision diff shows; no chemistry is checked here.
const input: FormulationInput = {
  materials: ["teos", "water-di"].map(referenceMaterial),
  basis: { type: "solidMass", grams: 10 },
  components: [{ materialId: "teos", weightFraction: 1 }],
  water: { materialId: "water-di", ratio: "R", value: 4 },
  steps: [{ name: "Cure", temperatureC: 120, durationH: 1 }],
};

const viscosity = VISCOSITY_SPEC;

const d = (a: Specification[] | null, b: Specification[] | null) =>
  diffRevisions({ input, result: null, specifications: a }, { input, result: null, specifications: b }).specifications;

describe("revision diff, specifications", () => {
  it("shows nothing when the copied specifications are unchanged, whatever their ids", () => {
    expect(d([viscosity], [{ ...viscosity, id: "00000000-0000-4000-8000-000000000002" }])).toEqual([]);
  });

  it("shows a changed limit by property name", () => {
    expect(d([viscosity], [{ ...viscosity, upper: 7 }])).toEqual([{ path: "Viscosity.upper", before: 6, after: 7 }]);
  });

  it("shows an added specification and a removed one", () => {
    const added = d(null, [viscosity]).map((e) => e.path);
    expect(added).toContain("Viscosity.target");
    const removed = d([viscosity], []);
    expect(removed.find((e) => e.path === "Viscosity.lower")).toEqual({ path: "Viscosity.lower", before: 4, after: null });
  });
});
