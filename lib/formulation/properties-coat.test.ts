/**
 * Invariants of the coat predictions, checked with fast-check (chemistry.md,
 * "What the coat will be"):
 * - dip: the thickness grows as U^(2/3) (Landau & Levich, 1942);
 * - spin: the thickness falls as rpm^(−1/2) (Meyerhofer, 1978), and the rpm for a target gives that target;
 * - the coat's index falls toward 1 as the porosity grows (Lorentz–Lorenz with air, Born & Wolf);
 * - VOC per litre less water ≥ VOC per litre (ASTM D3960: the less-water volume is smaller);
 * - no figure is NaN or infinite.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { dec } from "./decimal";
import { landauLevich } from "./film";
import type { FormulationInput } from "./input-schema";
import { indexFromTerm, lorentzLorenzTerm, mixtureIndex } from "./optics";
import { allNumbers, expectClose, ref } from "./test-support";

const RUNS = { numRuns: 60 };

/** A silica-based sol with a random share of titania, organosilane and water, diluted in ethanol. */
const sol = fc.record({
  titania: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 0.4, noNaN: true })),
  gptms: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 0.5, noNaN: true })),
  R: fc.double({ min: 0.5, max: 30, noNaN: true }),
  ethanol: fc.double({ min: 0, max: 20, noNaN: true }),
  carried: fc.boolean(),
});

function solInput(r: { titania: number; gptms: number; R: number; ethanol: number; carried: boolean }): FormulationInput {
  const teos = 1 - r.titania - r.gptms;
  return {
    materials: [ref("teos"), ref("gptms"), ref("ti-isopropoxide"), ref("acac"), ref("ethanol"), ref("water-di"), ref("hcl-37"), ref("polycarbonate")],
    basis: { type: "solidMass", grams: 10 },
    components: [
      { materialId: "teos", weightFraction: teos },
      { materialId: "gptms", weightFraction: r.gptms },
      { materialId: "ti-isopropoxide", weightFraction: r.titania },
    ],
    modifiers: r.titania > 0 ? [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }] : [],
    water: { materialId: "water-di", ratio: "R", value: r.R, countCarried: r.carried },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: r.ethanol },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    substrateId: "polycarbonate",
    steps: [{ name: "Cure", temperatureC: 120, durationH: 2 }],
  };
}

describe("coat predictions: properties", () => {
  it("grows the dip-coated thickness as the withdrawal speed to the power 2/3", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 50, noNaN: true }),
        fc.double({ min: 1.1, max: 10, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        fc.double({ min: 15, max: 72, noNaN: true }),
        (speed, factor, viscosity, tension) => {
          const slow = landauLevich(dec(viscosity), dec(speed), dec(tension), dec(0.85)).wetUm.toNumber();
          const fast = landauLevich(dec(viscosity), dec(speed * factor), dec(tension), dec(0.85)).wetUm.toNumber();
          expect(fast).toBeGreaterThan(slow);
          expectClose(fast / slow, Math.pow(factor, 2 / 3), 1e-12);
        },
      ),
      RUNS,
    );
  });

  it("gives a dry dip-coated thickness ∝ U^(2/3) through the whole engine, and the target speed reaches the target", () => {
    fc.assert(
      fc.property(sol, fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 20, max: 500, noNaN: true }), (r, speed, target) => {
        const base = solInput(r);
        const dip = (u: number) =>
          computeFormulation({ ...base, coating: { method: "dip", withdrawalMmPerS: u, viscosityMPaS: 3, surfaceTensionMNPerM: 23, targetDryThicknessNm: target } });
        const one = dip(speed);
        const two = dip(speed * 2);
        expectClose(two.coating!.dryThicknessNm / one.coating!.dryThicknessNm, Math.pow(2, 2 / 3), 1e-12);
        const atTarget = dip(one.coating!.withdrawalMmPerSForTarget!);
        expectClose(atTarget.coating!.dryThicknessNm, target, 1e-9);
      }),
      { numRuns: 25 },
    );
  });

  it("thins the spin-coated film as rpm to the power −1/2, and the rpm for a target gives the target", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 500, max: 10000 }),
        fc.double({ min: 1.1, max: 8, noNaN: true }),
        fc.double({ min: 50, max: 2000, noNaN: true }),
        fc.double({ min: 0.3, max: 3, noNaN: true }),
        (rpm, factor, calibrationNm, targetShare) => {
          const target = calibrationNm * targetShare; // keeps the rpm for the target within 333–33 333
          const base = solInput({ titania: 0, gptms: 0.3, R: 4, ethanol: 4, carried: true });
          const spin = (w: number) =>
            computeFormulation({ ...base, coating: { method: "spin", rpm: w, calibration: { rpm: 3000, dryThicknessNm: calibrationNm }, targetDryThicknessNm: target } })
              .coating!;
          const slow = spin(rpm);
          const fast = spin(rpm * factor);
          expect(fast.dryThicknessNm).toBeLessThan(slow.dryThicknessNm);
          expectClose(fast.dryThicknessNm / slow.dryThicknessNm, Math.pow(factor, -0.5), 1e-12);
          expectClose(spin(slow.rpmForTarget!).dryThicknessNm, target, 1e-9);
        },
      ),
      { numRuns: 25 },
    );
  });

  it("lowers the index toward 1 as the porosity grows", () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ share: fc.double({ min: 0.01, max: 1, noNaN: true }), index: fc.double({ min: 1.3, max: 2.6, noNaN: true }) }), { minLength: 1, maxLength: 5 }),
        fc.double({ min: 0, max: 0.95, noNaN: true }),
        fc.double({ min: 0.001, max: 0.02, noNaN: true }), // porosity + step ≤ 0.97: some solid is left
        (phases, porosity, step) => {
          const total = phases.reduce((s, p) => s + p.share, 0);
          const parts = phases.map((p) => ({ volumeFraction: dec(p.share / total), index: p.index }));
          const dense = mixtureIndex(parts, dec(0)).toNumber();
          const lower = mixtureIndex(parts, dec(porosity)).toNumber();
          const lowest = mixtureIndex(parts, dec(porosity + step)).toNumber();
          expect(lower).toBeLessThanOrEqual(dense);
          expect(lowest).toBeLessThan(lower);
          expect(lowest).toBeGreaterThan(1);
          // the dense mixture lies between its lowest and highest phase
          expect(dense).toBeGreaterThanOrEqual(Math.min(...phases.map((p) => p.index)) - 1e-12);
          expect(dense).toBeLessThanOrEqual(Math.max(...phases.map((p) => p.index)) + 1e-12);
        },
      ),
      RUNS,
    );
    // all air: n = 1 exactly; n from its own term comes back (Born & Wolf)
    expect(mixtureIndex([{ volumeFraction: dec(1), index: 1.5 }], dec(1)).toNumber()).toBe(1);
    expectClose(indexFromTerm(lorentzLorenzTerm(1.586)).toNumber(), 1.586, 1e-15);
  });

  it("lowers the whole engine's coat index when a bulk density below the theoretical one is measured", () => {
    fc.assert(
      fc.property(sol, fc.double({ min: 0.05, max: 0.6, noNaN: true }), (r, porosity) => {
        const dense = computeFormulation(solInput(r));
        const porous = computeFormulation({ ...solInput(r), measuredBulkDensity: dense.composite.theoreticalDensity * (1 - porosity) });
        expect(porous.optics!.refractiveIndex).toBeLessThan(dense.optics!.refractiveIndex);
        expect(porous.optics!.refractiveIndex).toBeGreaterThan(1);
      }),
      { numRuns: 25 },
    );
  });

  it("gives a VOC per litre less water at least the VOC per litre, and never NaN", () => {
    fc.assert(
      fc.property(sol, fc.double({ min: 0.5, max: 50, noNaN: true }), (r, wet) => {
        const result = computeFormulation({ ...solInput(r), coating: { method: "wetFilm", wetThicknessUm: wet, areaM2: 1 } });
        const voc = result.voc!;
        expect(voc.gramsPerLitreLessWater).toBeGreaterThanOrEqual(voc.gramsPerLitre);
        expect(voc.gramsPerLitre).toBeGreaterThan(0); // the hydrolysis alcohol is always there
        expect(voc.waterMl).toBeGreaterThan(0);
        for (const n of allNumbers(result)) expect(Number.isFinite(n)).toBe(true);
      }),
      RUNS,
    );
  });
});
