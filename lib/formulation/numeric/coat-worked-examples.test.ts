/**
 * Worked examples of the numeric coat figures: the worked examples of
 * worked-examples-coat.test.ts (each computed by hand there and again here
 * with plain JS numbers), now through numericCoat. Molar masses: IUPAC/CIAAW
 * 2021 abridged; material data: data/materials.ts, whose sources are named
 * there.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "../compute";
import type { FormulationInput } from "../input-schema";
import type { Material } from "../material-schema";
import { expectClose, ref } from "../test-support";
import { numericCoat } from "./coat";
import { numericFilm } from "./coat-film";
import { coatContextFromResult } from "./coat-test-support";
import type { NumericCoatFigures } from "./context";

const G = 9.80665; // m/s², standard gravity (BIPM SI Brochure)
const LL = (n: number): number => (n * n - 1) / (n * n + 2); // Lorentz–Lorenz term (Born & Wolf)
const indexOf = (L: number): number => Math.sqrt((1 + 2 * L) / (1 - L));

/** 10 g SiO2 from TEOS, R = 4, ethanol 4 mol/mol Si, HCl 0.01 mol/mol Si: the plain silica sol of Brinker & Scherer, ch. 3. */
function teosSol(extra: Partial<FormulationInput> = {}, materials: Material[] = []): FormulationInput {
  return {
    materials: [ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37"), ...materials],
    basis: { type: "solidMass", grams: 10 },
    components: [{ materialId: "teos", weightFraction: 1 }],
    water: { materialId: "water-di", ratio: "R", value: 4 },
    solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
    catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
    steps: [{ name: "Dry", temperatureC: 60, durationH: 1, stage: "drying" }],
    ...extra,
  };
}

// The TEOS sol by hand (worked-examples-coat.test.ts): n(Si) = 10 / 60.083 mol; TEOS 208.329 g/mol, 0.933 g/cm³;
// ethanol 46.069 g/mol, 0.7893 g/cm³; HCl 37 % (36.458 g/mol, 1.18 g/cm³, 63 % water); water 18.015 g/mol, 0.9982 g/cm³.
const nSi = 10 / 60.083;
const ethanolG = 4 * nSi * 46.069;
const hclStockG = (0.01 * nSi * 36.458) / 0.37;
const carriedWaterMol = (hclStockG * 0.63) / 18.015;
const addWaterG = (4 * nSi - carriedWaterMol) * 18.015;
const solMl = (nSi * 208.329) / 0.933 + ethanolG / 0.7893 + hclStockG / 1.18 + addWaterG / 0.9982;
const solG = nSi * 208.329 + ethanolG + hclStockG + addWaterG;
const phiS = 10 / 2.2 / solMl;

/** The numeric coat figures of an input, through the decimal engine's result. */
function coat(input: FormulationInput): NumericCoatFigures {
  const outcome = numericCoat(coatContextFromResult(input, computeFormulation(input)));
  if ("ok" in outcome) throw new Error(`refused: ${outcome.code} on ${outcome.field}`);
  return outcome;
}

describe("numeric coat figures: worked examples", () => {
  it("gives the Landau–Levich wet thickness for a stated η, U, γ and ρ", () => {
    // Landau & Levich, Acta Physicochim. URSS 17 (1942) 42: h = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)), SI units.
    // η 2 mPa·s, U 1 mm/s, γ 22 mN/m, ρ 850 kg/m³ → h = 3.0875 µm; Ca = 2e-6 / 0.022 = 9.0909e-5.
    // φ_s 0.05, P 0 → dry 3087.5 nm × 0.05 = 154.37 nm
    const film = numericFilm({ method: "dip", withdrawalMmPerS: 1, viscosityMPaS: 2, surfaceTensionMNPerM: 22 }, 0.05, 0, 0.85);
    expect(film.wetThicknessUm).toBeCloseTo(3.0875, 4);
    expectClose(film.wetThicknessUm, ((0.94 * Math.pow(2e-6, 2 / 3)) / (Math.pow(0.022, 1 / 6) * Math.sqrt(850 * G))) * 1e6, 1e-13);
    expectClose(film.capillaryNumber, 2e-6 / 0.022, 1e-15);
    expectClose(film.dryThicknessNm, film.wetThicknessUm * 1000 * 0.05, 1e-15);
  });

  it("dip coats the TEOS sol: wet and dry thickness, coverage and capillary number", () => {
    // ρ = 77.3979 g / 88.0715 mL = 0.878807 g/cm³; η 1.5 mPa·s, U 2 mm/s, γ 23 mN/m (Landau & Levich 1942):
    // h_wet = 3.94954 µm, h_dry = 3949.54 nm × 0.0516109 = 203.840 nm, coverage 1000 / 3.94954 = 253.194 m²/L
    const figures = coat(teosSol({ coating: { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 1.5, surfaceTensionMNPerM: 23, targetDryThicknessNm: 100, areaM2: 0.5 } }));
    const wetUm = ((0.94 * Math.pow(1.5e-3 * 2e-3, 2 / 3)) / (Math.pow(0.023, 1 / 6) * Math.sqrt((solG / solMl) * 1000 * G))) * 1e6;
    expect(figures.wetThicknessUm).toBeCloseTo(3.94954, 4);
    expect(figures.dryThicknessNm).toBeCloseTo(203.84, 2);
    expectClose(figures.wetThicknessUm, wetUm, 1e-12);
    expectClose(figures.dryThicknessNm, wetUm * 1000 * phiS, 1e-12);
    expectClose(figures.coverageM2PerL, 1000 / wetUm, 1e-12);
    expectClose(figures.capillaryNumber, (1.5e-3 * 2e-3) / 0.023, 1e-14);
    expect(figures.costTotal).toBeNaN(); // no prices
  });

  it("spin coats from one measured film, the wet film back from the dry, no capillary number", () => {
    // Meyerhofer, J. Appl. Phys. 49 (1978) 3993: 2000 rpm → 300 nm; at 3000 rpm 300 × (2000/3000)^(1/2) = 244.949 nm;
    // h_wet = 0.244949 µm / 0.0516109 = 4.74607 µm
    const figures = coat(teosSol({ coating: { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 300 } } }));
    expect(figures.dryThicknessNm).toBeCloseTo(244.949, 3);
    expectClose(figures.dryThicknessNm, 300 * Math.sqrt(2000 / 3000), 1e-14);
    expectClose(figures.wetThicknessUm, (0.3 * Math.sqrt(2000 / 3000)) / phiS, 1e-12);
    expect(figures.capillaryNumber).toBeNaN();
  });

  it("gives the dry film of a stated wet film, thicker where the coat is porous", () => {
    // 12 µm wet: dense 12 000 × 0.0516109 = 619.331 nm; P = 0.25 (bulk 1.65 of 2.2 g/cm³): 619.331 / 0.75 = 825.775 nm
    const dense = coat(teosSol({ coating: { method: "wetFilm", wetThicknessUm: 12 } }));
    const porous = coat(teosSol({ coating: { method: "wetFilm", wetThicknessUm: 12 }, measuredBulkDensity: 1.65 }));
    expectClose(dense.dryThicknessNm, 12000 * phiS, 1e-12);
    expect(porous.dryThicknessNm).toBeCloseTo(825.775, 2);
    expectClose(porous.dryThicknessNm, (12000 * phiS) / 0.75, 1e-12);
    expect(coat(teosSol()).wetThicknessUm).toBeNaN(); // no coating, no film
  });

  it("gives the Lorentz–Lorenz index of a silica–titania coat, its fall with porosity, and the mismatch to glass", () => {
    // Born & Wolf, Principles of Optics. 80 wt% SiO2 (2.20 g/cm³, n 1.4585) + 20 wt% TiO2 (2.7 g/cm³, n 1.95):
    // φ = 0.830769 / 0.169231, L = 0.308634 → n = 1.52946; P = 0.2: L = 0.246907 → n = 1.40839; soda-lime glass 1.52
    const input: FormulationInput = {
      materials: [ref("teos"), ref("ti-isopropoxide"), ref("ethanol"), ref("water-di"), ref("soda-lime-glass")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "teos", weightFraction: 0.8 },
        { materialId: "ti-isopropoxide", weightFraction: 0.2 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 2 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 8 },
      substrateId: "soda-lime-glass",
      steps: [{ name: "Cure", temperatureC: 150, durationH: 1 }],
    };
    const vSi = 0.8 / 2.2;
    const vTi = 0.2 / 2.7;
    const term = (vSi * LL(1.4585) + vTi * LL(1.95)) / (vSi + vTi);
    const dense = coat(input);
    expect(dense.refractiveIndex).toBeCloseTo(1.52946, 4);
    expectClose(dense.refractiveIndex, indexOf(term), 1e-12);
    expect(Math.abs(dense.indexMismatch - (indexOf(term) - 1.52))).toBeLessThan(1e-12);
    const porous = coat({ ...input, measuredBulkDensity: (0.8 * 1) / (vSi + vTi) });
    expect(porous.refractiveIndex).toBeCloseTo(1.40839, 4);
    expectClose(porous.refractiveIndex, indexOf(0.8 * term), 1e-12);
    // an opaque substrate (no index): the coat's index, no mismatch
    const onAluminium = coat({ ...input, materials: [...input.materials.slice(0, 4), ref("aluminium-6061")], substrateId: "aluminium-6061" });
    expectClose(onAluminium.refractiveIndex, indexOf(term), 1e-12);
    expect(onAluminium.indexMismatch).toBeNaN();
  });

  it("counts the bonded ligand as a phase of the index, and gives none when a phase lacks one", () => {
    // Visor hard coat: GPTMS residue 1.49, SiO2 1.4585, TiO2 1.95, bonded acac 1.452 (data/materials.ts); Born & Wolf.
    const input: FormulationInput = {
      materials: [ref("gptms"), ref("teos"), ref("ti-isopropoxide"), ref("acac"), ref("ethanol"), ref("water-di"), ref("polycarbonate")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "gptms", weightFraction: 0.7 },
        { materialId: "teos", weightFraction: 0.25 },
        { materialId: "ti-isopropoxide", weightFraction: 0.05 },
      ],
      modifiers: [{ materialId: "acac", precursorId: "ti-isopropoxide", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 1.5 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      substrateId: "polycarbonate",
      steps: [{ name: "Cure", temperatureC: 120, durationH: 2 }],
    };
    const result = computeFormulation(input);
    const indices: Record<string, number> = { gptms: 1.49, teos: 1.4585, "ti-isopropoxide": 1.95, acac: 1.452 };
    const term = result.composite.phases.reduce((sum, p) => sum + p.volumeFraction * LL(indices[p.materialId] as number), 0);
    const figures = coat(input);
    expectClose(figures.refractiveIndex, indexOf(term), 1e-12);
    expect(figures.indexMismatch).toBeLessThan(-0.05); // polycarbonate 1.586
    const noIndex = { ...ref("acac"), refractiveIndex: undefined };
    const missing = coat({ ...input, materials: input.materials.map((m) => (m.id === "acac" ? noIndex : m)) });
    expect(missing.refractiveIndex).toBeNaN();
    expect(missing.indexMismatch).toBeNaN();
  });

  it("gives the VOC of the TEOS sol, the hydrolysis ethanol included, per litre and per litre less water", () => {
    // EU 2004/42/EC: ethanol (bp 78.3 °C) is a VOC, HCl (no carbon) is not. VOC = added 30.6702 g + hydrolysis 30.6702 g = 61.3405 g;
    // 696.485 g/L of sol; water 0.665746 mol × 18.015 / 0.9982 = 12.0150 mL → 806.512 g/L less water (ASTM D3960, US EPA Method 24)
    const figures = coat(teosSol());
    const grams = ethanolG + 4 * nSi * 46.069;
    const waterMl = (4 * nSi * 18.015) / 0.9982;
    expect(figures.vocMassGrams).toBeCloseTo(61.3405, 3);
    expect(figures.vocGramsPerLitre).toBeCloseTo(696.485, 2);
    expect(figures.vocGramsPerLitreLessWater).toBeCloseTo(806.512, 2);
    expectClose(figures.vocMassGrams, grams, 1e-12);
    expectClose(figures.vocGramsPerLitreLessWater, (grams / (solMl - waterMl)) * 1000, 1e-12);
  });

  it("counts acetic acid and the 1-propanol a zirconium propoxide solution carries, not the modifier", () => {
    // Zr(OPr)4 70 wt% in 1-propanol, bonded acac 1 mol/mol Zr, S = 10 g (chemistry.md, Modifiers; EU 2004/42/EC):
    // carried 1-propanol 6.55011 g + hydrolysis 1-propanol 11.2155 g + acetic acid 0.280182 g = 18.0458 g
    const nZr = 10 / (1 + 91.11 / 123.222) / 123.222;
    const figures = coat({
      materials: [ref("zr-propoxide-70"), ref("1-propanol"), ref("acac"), ref("water-di"), ref("acetic-acid-glacial")],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "zr-propoxide-70", weightFraction: 1 }],
      modifiers: [{ materialId: "acac", precursorId: "zr-propoxide-70", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 2 },
      catalyst: { materialId: "acetic-acid-glacial", molPerNetworkAtom: 0.1 },
      steps: [{ name: "Cure", temperatureC: 120, durationH: 1 }],
    });
    expect(figures.vocMassGrams).toBeCloseTo(18.0458, 3);
    expectClose(figures.vocMassGrams, 0.3 * ((nZr * 327.576) / 0.7) + 4 * nZr * 60.096 + 0.1 * nZr * 60.052, 1e-12);
  });

  it("gives the epoxy–amine ratio of a GPTMS/APTES coat and of an epoxy resin with its polyetheramine", () => {
    // Lee & Neville, Handbook of Epoxy Resins (1967). 70 % GPTMS residue (167.2355 g/mol, EEW 236.339), 30 % APTES residue
    // (110.1875 g/mol, AHEW 110.686): r = 2 × (3 / 110.1875) / (7 / 167.2355) = 1.30092
    const input: FormulationInput = {
      materials: [ref("gptms"), ref("aptes"), ref("ethanol"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [
        { materialId: "gptms", weightFraction: 0.7 },
        { materialId: "aptes", weightFraction: 0.3 },
      ],
      water: { materialId: "water-di", ratio: "R", value: 3 },
      solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
      steps: [{ name: "Cure", temperatureC: 100, durationH: 1 }],
    };
    const ratio = coat(input).cureRatio;
    expect(ratio).toBeCloseTo(1.30092, 4);
    expectClose(ratio, (2 * (3 / 110.1875)) / (7 / 167.2355), 1e-12);
    // DGEBA (EEW 170.21) and polyetheramine (AHEW 60) as dry organic phases at 1 : 1 equivalents with 40 % silica: r = 1
    const wE = (0.6 * 170.21) / 230.21;
    const balanced = coat(
      teosSol(
        {
          components: [
            { materialId: "teos", weightFraction: 0.4 },
            { materialId: "epoxy-dgeba", weightFraction: wE },
            { materialId: "polyetheramine-230", weightFraction: 0.6 - wE },
          ],
        },
        [ref("epoxy-dgeba"), ref("polyetheramine-230")],
      ),
    );
    expectClose(balanced.cureRatio, 1, 1e-9);
    expect(coat(teosSol()).cureRatio).toBeNaN(); // no equivalent weight anywhere
  });

  it("gives the cost per batch, per kg dry, per litre and per m², and none when a line has no price", () => {
    // Invented prices (test data): TEOS 40/kg, ethanol 5/kg, water 1/kg, HCl 37 % 12/kg → total 1.55415;
    // per kg dry 155.415; per litre 17.6464; wet film 10 µm → 100 m²/L → per m² 0.176464
    const priced = (id: string, price: number): Material => ({ ...ref(id), pricePerKg: price });
    const input = teosSol({ coating: { method: "wetFilm", wetThicknessUm: 10 } });
    input.materials = [priced("teos", 40), priced("ethanol", 5), priced("water-di", 1), priced("hcl-37", 12)];
    const total = (nSi * 208.329 * 40 + ethanolG * 5 + addWaterG * 1 + hclStockG * 12) / 1000;
    const figures = coat(input);
    expect(figures.costTotal).toBeCloseTo(1.55415, 4);
    expectClose(figures.costTotal, total, 1e-12);
    expectClose(figures.costPerKgDry, total / 0.01, 1e-12);
    expectClose(figures.costPerLitreSol, total / (solMl / 1000), 1e-12);
    expectClose(figures.costPerM2, total / (solMl / 1000) / 100, 1e-12);
    const uncoated = coat({ ...input, coating: undefined });
    expectClose(uncoated.costTotal, total, 1e-12);
    expect(uncoated.costPerM2).toBeNaN();
    input.materials = [priced("teos", 40), ref("ethanol"), priced("water-di", 1), ref("hcl-37")];
    const partial = coat(input);
    for (const key of ["costTotal", "costPerKgDry", "costPerLitreSol", "costPerM2"] as const) expect(partial[key]).toBeNaN();
  });

  it("refuses water that takes more than the whole sol at the densities given, naming the water's density", () => {
    // 10 g SiO2 from 30 wt% colloidal silica (1.21 g/cm³): 33.333 g = 27.548 mL carrying 23.333 g water (1.2952 mol,
    // more than R = 4 asks, so none is added); at 0.5 g/cm³ that water is 46.667 mL, more than the sol.
    const input: FormulationInput = {
      materials: [ref("colloidal-silica-30"), ref("water-di")],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "colloidal-silica-30", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      steps: [{ name: "Dry", temperatureC: 60, durationH: 1 }],
    };
    const context = coatContextFromResult(input, computeFormulation(input));
    expectClose(context.solVolume, 10 / 0.3 / 1.21, 1e-12);
    const water = { ...ref("water-di"), density: 0.5 };
    const refused = numericCoat({ ...context, waterMaterial: water, byId: new Map([...context.byId, ["water-di", water]]) });
    expect(refused).toEqual({ ok: false, code: "invalid_input", field: "materials.1.density" });
  });
});
