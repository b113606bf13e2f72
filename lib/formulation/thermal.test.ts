/**
 * Thermal compatibility, against the rules of the formulation chemistry:
 * hard limit H = Td of an organic phase (under the step's atmosphere), and for
 * a substrate min(heat deflection temperature or else grade maximum, Td, Tm);
 * fail at T ≥ H; caution at T ≥ H − margin, above a substrate's service rating
 * when its short-term limit is known, at T ≥ Tg of an amorphous substrate, at
 * T ≥ Tm of an organic phase in drying and curing; highest allowed step =
 * lowest H − margin. Limits used are those of
 * data/materials.ts, restated in the comments.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import type { FormulationInput } from "./input-schema";
import { checkThermal, hardLimit, type ThermalSubject } from "./thermal";
import { ref } from "./test-support";

function onPolycarbonate(cureC: number, marginC?: number): FormulationInput {
  // GPTMS + TEOS hard coat on polycarbonate (Tg 147 °C, Td 450 °C, grade maximum 125 °C)
  return {
    materials: [ref("gptms"), ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37"), ref("polycarbonate")],
    basis: { type: "solidsContent", solMassGrams: 200, solidsFraction: 0.2 },
    components: [
      { materialId: "gptms", weightFraction: 0.7 },
      { materialId: "teos", weightFraction: 0.3 },
    ],
    water: { materialId: "water-di", ratio: "R", value: 1.5 },
    solvent: { materialId: "ethanol", mode: "fill" },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    substrateId: "polycarbonate",
    steps: [
      { name: "Hydrolysis", temperatureC: 25, durationH: 2 },
      { name: "Cure", temperatureC: cureC, durationH: 2 },
    ],
    ...(marginC === undefined ? {} : { marginC }),
  };
}

describe("thermal checks on a polycarbonate substrate", () => {
  // Polycarbonate (data/materials.ts): Tg 147, Td 450, heat deflection temperature 132 °C (1.8 MPa,
  // ISO 75-2 method A), continuous-use rating 125 °C. Hard limit H = min(450, 132) = 132 °C (Tm not set:
  // amorphous); caution from 132 − 20 = 112 °C, and above the 125 °C rating (keep it short).
  it("returns clear for a 100 °C cure", () => {
    const { thermal } = computeFormulation(onPolycarbonate(100));
    expect(thermal.status).toBe("clear");
    expect(thermal.maxAllowedC).toBe(112);
    expect(thermal.binding).toEqual({ materialId: "polycarbonate", limit: "heatDeflection" });
    expect(thermal.checks).toHaveLength(2);
    expect(thermal.checks[1]).toEqual({
      materialId: "polycarbonate",
      stepName: "Cure",
      temperatureC: 100,
      limit: "heatDeflection",
      limitC: 132,
      marginC: 20,
      status: "clear",
      stage: "curing",
      atmosphere: "air",
    });
  });

  it("returns caution for a 115 °C cure within the 20 °C margin", () => {
    // 112 ≤ 115 < 132
    const result = computeFormulation(onPolycarbonate(115));
    expect(result.thermal.status).toBe("caution");
    expect(result.thermal.checks[1]?.status).toBe("caution");
    expect(result.notices.find((n) => n.code === "thermal_limit_near")?.level).toBe("caution");
    expect(result.notices.map((n) => n.code)).not.toContain("above_service_rating");
  });

  it("returns fail for a 135 °C cure at or above the heat deflection temperature", () => {
    // 135 ≥ 132
    const result = computeFormulation(onPolycarbonate(135));
    expect(result.thermal.status).toBe("fail");
    expect(result.thermal.checks[0]?.status).toBe("clear");
    expect(result.thermal.checks[1]).toMatchObject({ status: "fail", limit: "heatDeflection", limitC: 132 });
    expect(result.notices.find((n) => n.code === "thermal_limit_exceeded")?.level).toBe("error");
  });

  it("fails exactly at the hard limit and uses the formulation's own margin", () => {
    // T = H = 132 → fail (T ≥ H); margin 5 → caution from 127, so 120 is clear and maxAllowed 127
    expect(computeFormulation(onPolycarbonate(132)).thermal.status).toBe("fail");
    const relaxed = computeFormulation(onPolycarbonate(120, 5)).thermal;
    expect(relaxed.status).toBe("clear");
    expect(relaxed.maxAllowedC).toBe(127);
    expect(relaxed.checks[1]?.marginC).toBe(5);
  });
});

describe("checkThermal", () => {
  const step = (temperatureC: number, name = "Step"): { name: string; temperatureC: number; durationH: number } => ({
    name,
    temperatureC,
    durationH: 1,
  });

  it("returns a caution at the glass transition of a substrate below its hard limit", () => {
    // substrate Tg 100, Td 300 → H = 300; 150 °C: not within the margin (280) but ≥ Tg → caution (softening)
    const substrate: ThermalSubject = {
      materialId: "s",
      name: "S",
      role: "substrate",
      path: "materials.0",
      thermal: { glassTransitionC: 100, degradationOnsetC: 300 },
    };
    const { thermal } = checkThermal([substrate], [], [step(150), step(90)], 20);
    expect(thermal.checks[0]).toMatchObject({ status: "caution", limit: "glassTransition", limitC: 100 });
    expect(thermal.checks[1]).toMatchObject({ status: "clear", limit: "degradationOnset", limitC: 300 });
  });

  it("returns a caution at the melting point of an organic phase", () => {
    // PCL: Tm 60, Td 350 → 65 °C melts the phase (caution), 59 °C is clear
    const pcl = ref("pcl");
    const subject: ThermalSubject = { materialId: "pcl", name: pcl.name, role: "organic", path: "materials.0", thermal: pcl.thermal };
    const { thermal } = checkThermal([subject], [], [step(65), step(59)], 20);
    expect(thermal.checks.map((c) => [c.status, c.limit])).toEqual([
      ["caution", "melting"],
      ["clear", "degradationOnset"],
    ]);
    expect(thermal.maxAllowedC).toBe(330);
  });

  it("includes the melting point in a substrate's hard limit but not in an organic phase's", () => {
    // UHMWPE substrate: Tm 135, Td 400, heat deflection 47 (so the 80 °C rating is not the hard limit) → H = 47
    expect(hardLimit({ materialId: "u", name: "U", role: "substrate", path: "", thermal: ref("uhmwpe").thermal })).toEqual({
      limit: "heatDeflection",
      limitC: 47,
    });
    // without a short-term limit the grade maximum is the hard limit
    expect(hardLimit({ materialId: "u", name: "U", role: "substrate", path: "", thermal: { meltingC: 135, degradationOnsetC: 400, maxServiceC: 80 } })).toEqual({
      limit: "maxService",
      limitC: 80,
    });
    // a substrate whose melting point is its lowest limit (aluminium alloy solidus 582 with no grade maximum)
    expect(hardLimit({ materialId: "a", name: "A", role: "substrate", path: "", thermal: { meltingC: 582 } })).toEqual({
      limit: "melting",
      limitC: 582,
    });
    expect(hardLimit({ materialId: "a", name: "A", role: "organic", path: "", thermal: { meltingC: 582 } })).toBeUndefined();
  });

  it("names the material and limit that bind the highest allowed step", () => {
    // PCL organic: H = 350 → 330; polycarbonate: H = 132 (heat deflection) → 112 → binding polycarbonate
    const subjects: ThermalSubject[] = [
      { materialId: "pcl", name: "PCL", role: "organic", path: "materials.0", thermal: ref("pcl").thermal },
      { materialId: "polycarbonate", name: "PC", role: "substrate", path: "materials.1", thermal: ref("polycarbonate").thermal },
    ];
    const { thermal } = checkThermal(subjects, [], [step(25)], 20);
    expect(thermal.maxAllowedC).toBe(112);
    expect(thermal.binding).toEqual({ materialId: "polycarbonate", limit: "heatDeflection" });
    expect(thermal.checks).toHaveLength(2);
  });

  it("returns an info notice, and no rows, for a material without thermal data", () => {
    const { thermal, notices } = checkThermal(
      [{ materialId: "x", name: "X", role: "organic", path: "materials.4", thermal: undefined }],
      [],
      [step(25)],
      20,
    );
    expect(thermal.checks).toEqual([]);
    expect(thermal.status).toBe("clear");
    expect(notices).toContainEqual(expect.objectContaining({ level: "info", code: "no_thermal_data", field: "materials.4.thermal" }));
  });

  it("returns a caution when no step reaches a conversion temperature, also with no steps at all", () => {
    const conversion = { materialId: "ca", name: "Ca nitrate", residueFormula: "CaO", conversionTemperatureC: 550, path: "materials.1" };
    const none = checkThermal([], [conversion], [], 20);
    expect(none.thermal.status).toBe("caution");
    expect(none.notices.map((n) => n.code)).toEqual(expect.arrayContaining(["conversion_not_reached", "no_process_steps"]));
    const reached = checkThermal([], [conversion], [step(25), step(550, "Anneal")], 20);
    expect(reached.thermal.status).toBe("clear");
    expect(reached.thermal.checks).toEqual([
      { materialId: "ca", stepName: "Anneal", temperatureC: 550, limit: "conversion", limitC: 550, marginC: 20, status: "clear", stage: "curing", atmosphere: "air" },
    ]);
  });

  it("says when a conversion temperature lies above what the organic phase allows", () => {
    // two-sided window: nitrate needs 550 °C, PCL allows at most 330 °C
    const { notices } = checkThermal(
      [{ materialId: "pcl", name: "PCL", role: "organic", path: "materials.0", thermal: ref("pcl").thermal }],
      [{ materialId: "ca", name: "Ca nitrate", residueFormula: "CaO", conversionTemperatureC: 550, path: "materials.1" }],
      [step(100)],
      20,
    );
    expect(notices.find((n) => n.code === "conversion_not_reached")?.message).toContain("330");
  });
});
