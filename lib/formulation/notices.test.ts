/**
 * Safety and model notices. Hazard facts (UN GHS statements, from memory):
 * TMOS H330 fatal if inhaled and H318 serious eye damage; methoxy precursors
 * release methanol on hydrolysis (Brinker & Scherer 1990, ch. 3); HCl and
 * ammonia stocks H314 corrosive; alkoxides moisture-sensitive and flammable.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import type { FormulationInput } from "./input-schema";
import { ref } from "./test-support";

function silica(precursorId: string, catalystId?: string): FormulationInput {
  return {
    materials: [ref(precursorId), ref("water-di"), ref("ethanol"), ...(catalystId ? [ref(catalystId)] : [])],
    basis: { type: "solidMass", grams: 5 },
    components: [{ materialId: precursorId, weightFraction: 1 }],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    ...(catalystId ? { catalyst: { materialId: catalystId, molPerNetworkAtom: 0.01 } } : {}),
    steps: [{ name: "Dry", temperatureC: 60, durationH: 12 }],
  };
}

describe("notices", () => {
  it("returns the methanol, inhalation and eye-damage cautions for TMOS", () => {
    const { notices, alcohol } = computeFormulation(silica("tmos"));
    expect(alcohol.map((a) => a.name)).toEqual(["methanol"]);
    const methanol = notices.find((n) => n.code === "methanol_released");
    const toxic = notices.find((n) => n.code === "toxic_by_inhalation");
    expect(methanol?.level).toBe("caution");
    expect(toxic?.message).toMatch(/Tetramethoxysilane.*acutely toxic by inhalation.*severe eye damage/);
    for (const notice of [methanol, toxic]) expect(notice?.message).toContain("safety data sheet");
  });

  it("returns no methanol caution for an ethoxy precursor", () => {
    const codes = computeFormulation(silica("teos")).notices.map((n) => n.code);
    expect(codes).not.toContain("methanol_released");
    expect(codes).not.toContain("toxic_by_inhalation");
    expect(codes).toContain("alkoxide_handling");
  });

  it("returns a corrosive caution for hydrochloric acid and for ammonia", () => {
    for (const catalyst of ["hcl-37", "ammonia-25"]) {
      const corrosive = computeFormulation(silica("teos", catalyst)).notices.find((n) => n.code === "corrosive");
      expect(corrosive?.message, catalyst).toContain(ref(catalyst).name);
      expect(corrosive?.message).toContain("safety data sheet");
    }
  });

  it("always states that composite figures and sol volume are ideal", () => {
    const notices = computeFormulation(silica("teos")).notices;
    const ideal = notices.find((n) => n.code === "ideal_composite");
    expect(ideal?.level).toBe("info");
    expect(ideal?.message).toMatch(/complete hydrolysis and condensation/);
    expect(ideal?.message).toMatch(/OH groups, water and some alkoxy/);
    expect(notices.find((n) => n.code === "ideal_mixing")?.message).toMatch(/ideal mixing/);
  });

  it("returns an info notice for an organic phase without thermal data", () => {
    const pclNoData = { ...ref("pcl"), id: "pcl-nodata", thermal: undefined };
    const input: FormulationInput = {
      ...silica("teos"),
      materials: [...silica("teos").materials, pclNoData],
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "pcl-nodata", weightFraction: 0.2 },
      ],
    };
    const notice = computeFormulation(input).notices.find((n) => n.code === "no_thermal_data");
    expect(notice).toMatchObject({ level: "info", field: "materials.3.thermal" });
  });
});
