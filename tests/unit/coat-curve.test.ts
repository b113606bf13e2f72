import { describe, expect, it } from "vitest";
import { coatCurve, scaledThickness } from "@/components/results/coat-curve";
import type { CoatingResult } from "@/lib/formulation";

const film = (over: Partial<CoatingResult>): CoatingResult => ({
  method: "dip",
  solidVolumeFraction: 0.1,
  wetThicknessUm: 5,
  dryThicknessNm: 500,
  coverageM2PerL: 200,
  ...over,
});

describe("coat curve", () => {
  it("returns thickness growing as U^(2/3) along a dip curve (Landau & Levich 1942)", () => {
    // Doubling U multiplies h by 2^(2/3) = 1.5874.
    expect(scaledThickness(2, 1, 500, 2 / 3)).toBeCloseTo(793.70, 1);
    const c = coatCurve({ method: "dip", withdrawalMmPerS: 1, viscosityMPaS: 3, surfaceTensionMNPerM: 23 }, film({ capillaryNumber: 1.3e-4 }))!;
    expect(c.axis).toBe("dip");
    expect(c.chosen).toEqual({ x: 1, dryNm: 500 });
    for (const p of c.points) expect(p.dryNm).toBeCloseTo(500 * Math.pow(p.x, 2 / 3), 6);
    // Ca 1.3e-4 at 1 mm/s reaches 0.01 at 76.9 mm/s: off the plot (up to 2.5 mm/s).
    expect(c.caLimitX).toBeUndefined();
    expect(c.points[0]!.x).toBeCloseTo(0.25, 9);
    expect(c.points.at(-1)!.x).toBeCloseTo(2.5, 9);
  });

  it("returns thickness falling as rpm^(−1/2) along a spin curve (Meyerhofer 1978), with the target marked", () => {
    // 400 nm at 2000 rpm; target 200 nm needs 2000 · (400/200)² = 8000 rpm.
    const c = coatCurve(
      { method: "spin", rpm: 2000, calibration: { rpm: 2000, dryThicknessNm: 400 }, targetDryThicknessNm: 200 },
      film({ method: "spin", dryThicknessNm: 400, rpmForTarget: 8000 }),
    )!;
    expect(c.target).toEqual({ x: 8000, dryNm: 200 });
    const at8000 = c.points.find((p) => Math.abs(p.x - 8000) < 1e-9);
    expect(at8000?.dryNm ?? scaledThickness(8000, 2000, 400, -0.5)).toBeCloseTo(200, 9);
    for (let i = 1; i < c.points.length; i++) expect(c.points[i]!.dryNm).toBeLessThan(c.points[i - 1]!.dryNm);
    expect(c.points.at(-1)!.x).toBeCloseTo(12000, 6);
  });

  describe("edge cases", () => {
    it("returns no curve for a wet film or without a coat", () => {
      expect(coatCurve({ method: "wetFilm", wetThicknessUm: 10 }, film({ method: "wetFilm" }))).toBeNull();
      expect(coatCurve(undefined, undefined)).toBeNull();
    });

    it("marks the speed where Ca reaches 0.01 when it falls on the plot", () => {
      // Ca = 0.004 at 1 mm/s: 0.01 at 2.5 mm/s, the plot's right edge.
      const c = coatCurve({ method: "dip", withdrawalMmPerS: 1, viscosityMPaS: 100, surfaceTensionMNPerM: 25 }, film({ capillaryNumber: 0.004 }))!;
      expect(c.caLimitX).toBeCloseTo(2.5, 9);
    });
  });
});
