import { describe, expect, it } from "vitest";
import type { FormulationResult } from "@/lib/formulation";
import { isOutOfSpec } from "./out-of-spec";
import { PROPOSED_PROPERTIES, proposedSpecifications } from "./proposed-specs";
import { specificationsSchema } from "./specification";

/** A hand-made result with round figures, so every proposed value can be checked by hand. */
function fakeResult(extra: Partial<FormulationResult> = {}): FormulationResult {
  return {
    sol: { massGrams: 120, volumeMl: 150, residueGramsPerL: 80, solidsFraction: 0.1 },
    ...extra,
  } as unknown as FormulationResult;
}

let n = 0;
const ids = () => `00000000-0000-4000-8000-${String(++n).padStart(12, "0")}`;

describe("proposed specifications", () => {
  it("proposes solids (% w/w) and sol density (g/cm³) with ±10 % limits, nothing else without a coat or VOC", () => {
    const specs = proposedSpecifications(fakeResult(), ids);
    expect(specs.map((s) => s.property)).toEqual([PROPOSED_PROPERTIES.solids, PROPOSED_PROPERTIES.density]);
    const [solids, density] = specs;
    // solids: 0.1 × 100 = 10 % w/w; ±10 % (common practice, no source) → 9 … 11
    expect(solids).toMatchObject({ unit: "% w/w", target: 10, lower: 9, upper: 11, numeric: true, origin: "computed" });
    expect(solids!.method).toMatch(/non-volatile/i);
    expect(solids!.method).toMatch(/differs from the ideal/);
    // density: 120 g / 150 mL = 0.8 g/cm³ → 0.72 … 0.88 (exact in decimal arithmetic)
    expect(density).toMatchObject({ unit: "g/cm³", target: 0.8, lower: 0.72, upper: 0.88 });
    // what it proposes passes the stored schema
    expect(specificationsSchema.safeParse(specs).success).toBe(true);
  });

  it("adds the dry thickness (nm) when a coat is set and the VOC (g/L) when computed", () => {
    const result = fakeResult({
      coating: { method: "dip", solidVolumeFraction: 0.05, wetThicknessUm: 4, dryThicknessNm: 250, coverageM2PerL: 250 },
      voc: { massGrams: 80, gramsPerLitre: 533.3, gramsPerLitreLessWater: 600, waterMl: 10 },
    });
    const specs = proposedSpecifications(result, ids);
    const thick = specs.find((s) => s.property === PROPOSED_PROPERTIES.dryThickness);
    const voc = specs.find((s) => s.property === PROPOSED_PROPERTIES.voc);
    expect(thick).toMatchObject({ unit: "nm", target: 250, lower: 225, upper: 275 });
    // 533.3 × 0.9 = 479.97, × 1.1 = 586.63
    expect(voc).toMatchObject({ unit: "g/L", target: 533.3, lower: 479.97, upper: 586.63 });
    expect(new Set(specs.map((s) => s.id)).size).toBe(4);
  });

  it("proposes nothing without a result", () => {
    expect(proposedSpecifications(null)).toEqual([]);
  });
});

describe("out of specification", () => {
  const spec = { lower: 9, upper: 11 };
  it("keeps the limits inclusive (common practice, no source)", () => {
    expect(isOutOfSpec(spec, 9)).toBe(false);
    expect(isOutOfSpec(spec, 11)).toBe(false);
    expect(isOutOfSpec(spec, 10)).toBe(false);
  });
  it("marks a value just outside either limit", () => {
    expect(isOutOfSpec(spec, 8.999)).toBe(true);
    expect(isOutOfSpec(spec, 11.001)).toBe(true);
  });
  it("does not bound on a missing limit", () => {
    expect(isOutOfSpec({ lower: null, upper: 5 }, -1e9)).toBe(false);
    expect(isOutOfSpec({ lower: 5, upper: null }, 1e9)).toBe(false);
    expect(isOutOfSpec({ lower: 5, upper: null }, 4)).toBe(true);
  });
});
