/**
 * Engine v2 bugs: each case below failed before its fix. Expected figures are
 * worked out by hand in the comments; sources are named where a fact of the
 * chemistry is checked (Brinker & Scherer, Sol-Gel Science, 1990, ch. 3 for
 * the water ratios; the rest is common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { FormulationError } from "./errors";
import type { FormulationInput } from "./input-schema";
import type { Material } from "./material-schema";
import { expectClose, line, ref } from "./test-support";

const codes = (input: FormulationInput): string[] => computeFormulation(input).notices.map((n) => n.code);

function mix(ids: [string, number][], ratio: number, extra: Material[] = []): FormulationInput {
  return {
    materials: [...ids.map(([id]) => ref(id)), ref("water-di"), ref("ethanol"), ...extra],
    basis: { type: "solidMass", grams: 10 },
    components: ids.map(([materialId, weightFraction]) => ({ materialId, weightFraction })),
    water: { materialId: "water-di", ratio: "R", value: ratio },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    steps: [{ name: "Dry", temperatureC: 60, durationH: 12 }],
  };
}

/** Colloidal silica, 30 wt% SiO2 in water (data/materials.ts; chemistry.md, "Colloidal and oligomeric precursors"). */
const colloidalSilica: Material = ref("colloidal-silica-30");

describe("bug 1: water notices compare with a relative tolerance", () => {
  it("returns no full-hydrolysis note for TEOS + TMOS at R = 4 (4 OR per Si: exactly the full-hydrolysis ratio)", () => {
    const c = codes(mix([["teos", 0.5], ["tmos", 0.5]], 4));
    expect(c).not.toContain("below_full_hydrolysis");
    expect(c).not.toContain("below_net_condensation");
  });

  it("returns no net-condensation caution for TEOS + titanium isopropoxide at R = 2 (Σg/2 per metal = 2)", () => {
    const c = codes(mix([["teos", 0.7], ["ti-isopropoxide", 0.3]], 2));
    expect(c).not.toContain("below_net_condensation");
    expect(c).toContain("below_full_hydrolysis");
  });

  it("still cautions just below the net-condensation ratio (R = 1.99)", () => {
    expect(codes(mix([["teos", 0.5], ["tmos", 0.5]], 1.99))).toContain("below_net_condensation");
  });
});

describe("bug 2: colloidal silica (no hydrolysable groups) computes with an R target", () => {
  it("returns a recipe for colloidal silica alone at R = 10 with its own water counted", () => {
    const input: FormulationInput = {
      materials: [colloidalSilica, ref("water-di")],
      basis: { type: "solidMass", grams: 30 },
      components: [{ materialId: colloidalSilica.id, weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 10 },
      steps: [],
    };
    const result = computeFormulation(input);
    // 30 g SiO2 = 0.499309 mol; sol 100 g as supplied carries 70 g water = 3.885651 mol (18.015 g/mol);
    // target 10 · 0.499309 = 4.99309 mol; add 1.107440 mol.
    const n = 30 / 60.083;
    expectClose(line(result, colloidalSilica.id).massGrams, 100, 1e-12);
    expectClose(result.water.carriedMol, 70 / 18.015, 1e-12);
    expectClose(result.water.addMol, 10 * n - 70 / 18.015, 1e-9);
    expect(result.water.effectiveH).toBeUndefined();
    expect(result.water.hydrolysisMol).toBe(0);
  });

  it("returns a recipe for colloidal silica with an aqueous polymer", () => {
    const input: FormulationInput = {
      materials: [colloidalSilica, ref("pva-10-aq"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: colloidalSilica.id, weightFraction: 0.8 },
        { materialId: "pva-10-aq", weightFraction: 0.2 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 20 },
      steps: [],
    };
    const result = computeFormulation(input);
    expectClose(line(result, colloidalSilica.id).massGrams, 8 / 0.3, 1e-12);
    expect(result.water.effectiveR).toBeGreaterThan(20 - 1e-9);
  });

  it("still refuses an h target with no hydrolysable groups, naming the water ratio", () => {
    const input: FormulationInput = {
      materials: [colloidalSilica, ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: colloidalSilica.id, weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "h", value: 2 },
      steps: [],
    };
    expect(() => computeFormulation(input)).toThrow(FormulationError);
    try {
      computeFormulation(input);
    } catch (err) {
      expect((err as FormulationError).code).toBe("no_hydrolysable_groups");
      expect((err as FormulationError).field).toBe("water.ratio");
    }
  });
});

describe("bug 4: glass-transition cautions only for amorphous substrates", () => {
  const coat = (substrateId: string, temperatureC: number): FormulationInput => ({
    ...mix([["teos", 1]], 4),
    materials: [ref("teos"), ref("water-di"), ref("ethanol"), ref(substrateId)],
    substrateId,
    steps: [{ name: "Ambient", temperatureC, durationH: 1 }],
  });

  it("returns clear for UHMWPE (semi-crystalline, Tg −120 °C, Tm 135 °C) at 20 °C", () => {
    const result = computeFormulation(coat("uhmwpe", 20));
    expect(result.thermal.status).toBe("clear");
  });

  it("still cautions above Tg for an amorphous substrate (PMMA sheet, no melting point)", () => {
    const pmma = ref("pmma-sheet");
    expect(pmma.thermal?.meltingC).toBeUndefined();
    const tg = pmma.thermal!.glassTransitionC!;
    const max = pmma.thermal!.maxServiceC!;
    // Only meaningful when Tg lies below the hard limit − margin; otherwise the hard rule speaks first.
    if (tg < max - 20) expect(computeFormulation(coat("pmma-sheet", tg + 1)).thermal.status).toBe("caution");
    else expect(computeFormulation(coat("pmma-sheet", tg + 1)).thermal.status).not.toBe("clear");
  });
});

describe("bug 3: solvent carried by a precursor solution counts toward the same solvent's molar ratio", () => {
  it("returns a propanol ratio of exactly 2 when the form says 2, counting the propanol of the zirconium solution", () => {
    // GPTMS 75 % + ZrO2 25 % of 50 g from a 70 % Zr(OPr)4 solution in 1-propanol (data/materials.ts, solventId "1-propanol").
    // Before the fix the 14.24 g of carried propanol was ignored and the real ratio came out above 2.
    const input: FormulationInput = {
      materials: [ref("gptms"), ref("zr-propoxide-70"), ref("methacrylic-acid"), ref("1-propanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 50 },
      components: [
        { materialId: "gptms", weightFraction: 0.75 },
        { materialId: "zr-propoxide-70", weightFraction: 0.25 },
      ],
      modifiers: [{ materialId: "methacrylic-acid", precursorId: "zr-propoxide-70", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 1.5 },
      solvent: { materialId: "1-propanol", mode: "molPerNetworkAtom", value: 2 },
      steps: [],
    };
    const result = computeFormulation(input);
    const atoms = result.lines.reduce((s, l) => s + (l.networkAtomMol ?? 0), 0);
    const propanol = (line(result, "1-propanol").massGrams + (line(result, "zr-propoxide-70").carriedSolventGrams ?? 0)) / 60.096;
    expectClose(propanol / atoms, 2, 1e-12);
    expectClose(result.solvent?.molPerNetworkAtom, 2, 1e-12);
  });
});

describe("bug 5: melting cautions only in drying and curing", () => {
  const withOrganic = (id: string, temperatureC: number, stage: "sol" | "drying" | "curing"): FormulationInput => ({
    materials: [ref("teos"), ref(id), ref("water-di"), ref("ethanol")],
    basis: { type: "solidMass", grams: 10 },
    components: [
      { materialId: "teos", weightFraction: 0.8 },
      { materialId: id, weightFraction: 0.2 },
    ],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    steps: [{ name: "Step", temperatureC, durationH: 1, stage }],
  });

  it("returns clear for PEG (Tm 52 °C) aged at 60 °C in the sol", () => {
    expect(computeFormulation(withOrganic("peg-2000", 60, "sol")).thermal.status).toBe("clear");
  });

  it("returns clear for a gelatin sol made at 37 °C (Tm 35 °C)", () => {
    expect(computeFormulation(withOrganic("gelatin", 37, "sol")).thermal.status).toBe("clear");
  });

  it("still cautions when PEG is dried at 60 °C", () => {
    expect(computeFormulation(withOrganic("peg-2000", 60, "drying")).thermal.status).toBe("caution");
  });
});

describe("bug 6: a short cure above a plastic's long-term rating is a caution, not a failure", () => {
  it("returns caution, with the hours above 125 °C, for polycarbonate cured 30 min at 128 °C", () => {
    const input: FormulationInput = { ...mix([["teos", 1]], 4, [ref("polycarbonate")]), substrateId: "polycarbonate", steps: [{ name: "Cure", temperatureC: 128, durationH: 0.5 }] };
    const result = computeFormulation(input);
    expect(result.thermal.status).toBe("caution");
    expect(result.notices.find((n) => n.code === "above_service_rating")?.message).toContain("0.5 h");
  });
});

describe("bug 7: smaller defects", () => {
  const fill = (solidsFraction: number): FormulationInput => ({
    ...mix([["teos", 1]], 4),
    basis: { type: "solidsContent", solMassGrams: 100, solidsFraction },
    solvent: { materialId: "ethanol", mode: "fill" },
  });

  it("omits a solvent-fill line below 1e-9 g when the reagents fill the sol exactly", () => {
    // TEOS w = 1 at R = 4: per g SiO2, 208.33/60.083 g TEOS + 4 · 18.015/60.083 g water = k g of reagents;
    // the highest solids content is 1/k, where the fill has no room left.
    const k = (ref("teos").molarMass! + 4 * 18.015) / ref("teos").precursor!.residueMolarMass;
    const result = computeFormulation(fill(1 / k));
    expect(result.lines.find((l) => l.role === "solvent")).toBeUndefined();
    for (const l of result.lines) expect(l.massGrams).toBeGreaterThan(1e-9);
  });

  it("states the highest reachable solids content when the target is too high", () => {
    const k = (ref("teos").molarMass! + 4 * 18.015) / ref("teos").precursor!.residueMolarMass;
    try {
      computeFormulation(fill(0.5));
      expect.unreachable();
    } catch (err) {
      expect((err as FormulationError).code).toBe("solids_content_too_high");
      expect((err as FormulationError).message).toContain(`${Number((1 / k).toPrecision(4))}`);
    }
  });

  it("checks an organic phase with only a Tg instead of calling it unchecked", () => {
    const resin: Material = { id: "resin-tg", name: "Resin with a Tg only", kind: "organic", density: 1.1, thermal: { glassTransitionC: 60 } };
    const input: FormulationInput = { ...mix([["teos", 0.7]], 4, [resin]), components: [{ materialId: "teos", weightFraction: 0.7 }, { materialId: "resin-tg", weightFraction: 0.3 }], steps: [{ name: "Cure", temperatureC: 80, durationH: 1 }] };
    const result = computeFormulation(input);
    expect(result.notices.map((n) => n.code)).not.toContain("no_thermal_data");
    expect(result.thermal.checks.some((c) => c.materialId === "resin-tg" && c.limit === "glassTransition")).toBe(true);
  });

  it("notes an assay below 1 whose balance is not stated", () => {
    const tmos98: Material = { ...ref("tmos"), id: "tmos-98", name: "TMOS 98 %", assay: 0.98, waterFraction: undefined, solventFraction: undefined };
    const input: FormulationInput = { ...mix([], 4, [tmos98]), components: [{ materialId: "tmos-98", weightFraction: 1 }] };
    const notice = computeFormulation(input).notices.find((n) => n.code === "assay_balance_unstated");
    expect(notice?.message).toMatch(/TMOS 98 %.*2 %/);
  });

  it("cautions on a catalyst ratio above 1 mol per mol network atom", () => {
    const input: FormulationInput = { ...mix([["teos", 1]], 4, [ref("hcl-37")]), catalyst: { materialId: "hcl-37", molPerNetworkAtom: 10_000 } };
    expect(codes(input)).toContain("catalyst_ratio_high");
    const ok: FormulationInput = { ...input, catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 } };
    expect(codes(ok)).not.toContain("catalyst_ratio_high");
  });

  it("scales weight fractions typed as 33.3 / 33.3 / 33.3 % to 1 with a notice", () => {
    const input = mix([["teos", 0.333], ["mtes", 0.333], ["gptms", 0.333]], 4);
    const result = computeFormulation(input);
    expect(result.notices.find((n) => n.code === "fractions_scaled")?.message).toMatch(/0\.999/);
    const exact = computeFormulation(mix([["teos", 1 / 3], ["mtes", 1 / 3], ["gptms", 1 / 3]], 4));
    expectClose(line(result, "teos").massGrams, line(exact, "teos").massGrams, 1e-12);
    expectClose(result.composite.phases.reduce((s, p) => s + p.weightFraction, 0), 1, 1e-12);
  });

  it("still refuses fractions more than 0.5 % away from 1", () => {
    expect(() => computeFormulation(mix([["teos", 0.5], ["mtes", 0.49]], 4))).toThrow(/sum to 0\.99/);
  });
});
