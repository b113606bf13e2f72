/**
 * Worked examples of the coat predictions (chemistry.md, "What the coat will
 * be"), each computed by hand in the comments and checked again below with
 * plain JS numbers, not the engine's decimal code. Molar masses: IUPAC/CIAAW
 * 2021 abridged; material data: data/materials.ts, whose sources are named
 * there.
 */
import { describe, expect, it } from "vitest";
import { computeFormulation } from "./compute";
import { FormulationError } from "./errors";
import { landauLevich } from "./film";
import { dec } from "./decimal";
import type { FormulationInput } from "./input-schema";
import type { Material } from "./material-schema";
import { expectClose, line, ref } from "./test-support";

const G = 9.80665; // m/s², standard gravity (BIPM SI Brochure)
const LL = (n: number): number => (n * n - 1) / (n * n + 2); // Lorentz–Lorenz term (Born & Wolf)

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

// The TEOS sol by hand (CIAAW 2021 abridged molar masses; densities of data/materials.ts, CRC Handbook):
// n(Si) = 10 / 60.083 = 0.166436 mol; TEOS 0.166436 × 208.329 = 34.6735 g = 37.1635 mL (0.933)
// ethanol 4 × 0.166436 = 0.665746 mol = 30.6702 g = 38.8575 mL (0.7893)
// HCl 0.00166436 mol × 36.458 / 0.37 = 0.163998 g stock = 0.138982 mL (1.18), carrying 0.63 × 0.163998 / 18.015 = 0.00573516 mol water
// water: target 4 × 0.166436 = 0.665746 mol, add 0.660011 mol = 11.8901 g = 11.9115 mL (0.9982)
// sol: 77.3979 g, 88.0715 mL; dense silica 10 / 2.2 = 4.54545 mL → φ_s = 0.0516109
const nSi = 10 / 60.083;
const teosMl = (nSi * 208.329) / 0.933;
const ethanolG = 4 * nSi * 46.069;
const ethanolMl = ethanolG / 0.7893;
const hclStockG = (0.01 * nSi * 36.458) / 0.37;
const carriedWaterMol = (hclStockG * 0.63) / 18.015;
const addWaterG = (4 * nSi - carriedWaterMol) * 18.015;
const solMl = teosMl + ethanolMl + hclStockG / 1.18 + addWaterG / 0.9982;
const solG = nSi * 208.329 + ethanolG + hclStockG + addWaterG;
const phiS = 10 / 2.2 / solMl;

describe("coat predictions: worked examples", () => {
  it("gives the Landau–Levich wet thickness for a stated η, U, γ and ρ", () => {
    // Landau & Levich, Acta Physicochim. URSS 17 (1942) 42: h = 0.94 (ηU)^(2/3) / (γ^(1/6) (ρg)^(1/2)), SI units.
    // η = 2 mPa·s = 0.002 Pa·s, U = 1 mm/s = 0.001 m/s, γ = 22 mN/m = 0.022 N/m, ρ = 0.85 g/cm³ = 850 kg/m³:
    // ηU = 2e-6 N/m → (ηU)^(2/3) = 1.58740e-4; γ^(1/6) = 0.529343; (ρg)^(1/2) = (850 × 9.80665)^(1/2) = 91.2998
    // h = 0.94 × 1.58740e-4 / (0.529343 × 91.2998) = 1.49216e-4 / 48.3293 = 3.08750e-6 m = 3.0875 µm
    // Ca = ηU / γ = 2e-6 / 0.022 = 9.0909e-5 (≪ 0.01, inside the law's range)
    const result = landauLevich(dec(2), dec(1), dec(22), dec(0.85));
    expect(result.wetUm.toNumber()).toBeCloseTo(3.0875, 4);
    expectClose(result.wetUm.toNumber(), (0.94 * Math.pow(2e-6, 2 / 3)) / (Math.pow(0.022, 1 / 6) * Math.sqrt(850 * G)) * 1e6, 1e-12);
    expectClose(result.capillaryNumber.toNumber(), 2e-6 / 0.022, 1e-15);
  });

  it("dip coats the TEOS sol: wet and dry thickness, coverage, sol for an area and the speed for a target", () => {
    // Same law on the sol above: ρ = 77.3979 g / 88.0715 mL = 0.878807 g/cm³; η 1.5 mPa·s, U 2 mm/s, γ 23 mN/m.
    // ηU = 3e-6 → (ηU)^(2/3) = 2.08008e-4; γ^(1/6) = 0.533279; (ρg)^(1/2) = (878.807 × 9.80665)^(1/2) = 92.8340
    // h_wet = 0.94 × 2.08008e-4 / (0.533279 × 92.8340) = 3.94954e-6 m = 3.94954 µm
    // h_dry = h_wet · φ_s = 3949.54 nm × 0.0516109 = 203.840 nm (P = 0: no bulk density stated)
    // coverage = 1000 / 3.94954 = 253.194 m²/L; 0.5 m² takes 0.5 × 3.94954 = 1.97477 mL of sol
    // target 100 nm: U_t = 2 × (100 / 203.840)^(3/2) = 2 × 0.343611 = 0.687222 mm/s (Brinker et al., Thin Solid Films 201 (1991) 97)
    const result = computeFormulation(
      teosSol({ coating: { method: "dip", withdrawalMmPerS: 2, viscosityMPaS: 1.5, surfaceTensionMNPerM: 23, targetDryThicknessNm: 100, areaM2: 0.5 } }),
    );
    const rho = (solG / solMl) * 1000;
    const wetUm = ((0.94 * Math.pow(1.5e-3 * 2e-3, 2 / 3)) / (Math.pow(0.023, 1 / 6) * Math.sqrt(rho * G))) * 1e6;
    const dryNm = wetUm * 1000 * phiS;
    const coating = result.coating!;
    expect(coating.method).toBe("dip");
    expect(coating.wetThicknessUm).toBeCloseTo(3.94954, 4);
    expect(coating.dryThicknessNm).toBeCloseTo(203.840, 2);
    expectClose(coating.solidVolumeFraction, phiS, 1e-12);
    expectClose(coating.wetThicknessUm, wetUm, 1e-12);
    expectClose(coating.dryThicknessNm, dryNm, 1e-12);
    expectClose(coating.coverageM2PerL, 1000 / wetUm, 1e-12);
    expectClose(coating.solMlForArea, 0.5 * wetUm, 1e-12);
    expectClose(coating.capillaryNumber, (1.5e-3 * 2e-3) / 0.023, 1e-12);
    expectClose(coating.withdrawalMmPerSForTarget, 2 * Math.pow(100 / dryNm, 1.5), 1e-12);
    expect(coating.withdrawalMmPerSForTarget).toBeCloseTo(0.687222, 5);
    expect(coating.rpmForTarget).toBeUndefined();
    expect(result.notices.map((n) => n.code)).not.toContain("dip_thickness_law_out_of_range");
    expect(result.notices.map((n) => n.code)).toContain("coat_figures_ideal");
  });

  it("cautions when the capillary number passes 0.01 (a fast pull of a viscous sol)", () => {
    // η 50 mPa·s, U 10 mm/s, γ 23 mN/m: Ca = 0.05 × 0.01 / 0.023 = 0.0217 > 0.01 (common practice, from memory)
    const result = computeFormulation(teosSol({ coating: { method: "dip", withdrawalMmPerS: 10, viscosityMPaS: 50, surfaceTensionMNPerM: 23 } }));
    expectClose(result.coating?.capillaryNumber, (0.05 * 0.01) / 0.023, 1e-12);
    const notice = result.notices.find((n) => n.code === "dip_thickness_law_out_of_range");
    expect(notice?.level).toBe("caution");
    expect(notice?.field).toBe("coating.withdrawalMmPerS");
  });

  it("gives a spin speed for a target from one measured film, and the wet film back from the dry", () => {
    // Meyerhofer, J. Appl. Phys. 49 (1978) 3993: h ∝ ω^(−1/2). Calibration 2000 rpm → 300 nm.
    // At 3000 rpm: h = 300 × (2000 / 3000)^(1/2) = 300 × 0.816497 = 244.949 nm
    // target 150 nm: ω_t = 2000 × (300 / 150)² = 8000 rpm
    // wet film: h_wet = h_dry (1 − P) / φ_s = 0.244949 µm / 0.0516109 = 4.74607 µm; coverage 1000 / 4.74607 = 210.701 m²/L
    const result = computeFormulation(
      teosSol({ coating: { method: "spin", rpm: 3000, calibration: { rpm: 2000, dryThicknessNm: 300 }, targetDryThicknessNm: 150 } }),
    );
    const coating = result.coating!;
    expect(coating.dryThicknessNm).toBeCloseTo(244.949, 3);
    expectClose(coating.dryThicknessNm, 300 * Math.sqrt(2000 / 3000), 1e-12);
    expectClose(coating.rpmForTarget, 8000, 1e-15);
    expectClose(coating.wetThicknessUm, 0.3 * Math.sqrt(2000 / 3000) / phiS, 1e-12);
    expectClose(coating.coverageM2PerL, 1000 / (0.3 * Math.sqrt(2000 / 3000) / phiS), 1e-12);
    expect(coating.capillaryNumber).toBeUndefined();
  });

  it("gives the dry film of a stated wet film, thicker where the coat is porous", () => {
    // A 12 µm wet film: h_dry = 12 000 nm × φ_s / (1 − P). With P = 0.25 (bulk density 0.75 × 2.2 = 1.65 g/cm³):
    // 12 000 × 0.0516109 / 0.75 = 825.775 nm; dense (no bulk density) 619.331 nm.
    const dense = computeFormulation(teosSol({ coating: { method: "wetFilm", wetThicknessUm: 12 } }));
    const porous = computeFormulation(teosSol({ coating: { method: "wetFilm", wetThicknessUm: 12 }, measuredBulkDensity: 1.65 }));
    expectClose(dense.coating?.dryThicknessNm, 12000 * phiS, 1e-12);
    expectClose(porous.coating?.dryThicknessNm, (12000 * phiS) / (1 - (1 - 1.65 / 2.2)), 1e-12);
    expect(porous.coating?.dryThicknessNm).toBeCloseTo(825.775, 2);
  });

  it("gives the Lorentz–Lorenz index of a silica–titania coat and its fall with porosity", () => {
    // Born & Wolf, Principles of Optics: (n² − 1)/(n² + 2) = (1 − P) Σ φ_k (n_k² − 1)/(n_k² + 2).
    // 80 wt% SiO2 (2.20 g/cm³, n 1.4585) + 20 wt% amorphous TiO2 (2.7 g/cm³, n 1.95), data/materials.ts:
    // w/ρ: 0.8 / 2.2 = 0.363636, 0.2 / 2.7 = 0.0740741, Σ 0.437710 → φ = 0.830769, 0.169231; ρ_th = 2.28462
    // L(1.4585) = 1.12722 / 4.12722 = 0.273119; L(1.95) = 2.8025 / 5.8025 = 0.482981
    // L = 0.830769 × 0.273119 + 0.169231 × 0.482981 = 0.308634 → n = ((1 + 2L) / (1 − L))^(1/2) = (1.617268 / 0.691366)^(1/2) = 1.52946
    // With P = 0.2 (bulk density 0.8 × 2.28462 = 1.82769 g/cm³): L = 0.8 × 0.308634 = 0.246907 → n = 1.40839
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
    const index = (L: number): number => Math.sqrt((1 + 2 * L) / (1 - L));
    const dense = computeFormulation(input);
    expect(dense.optics?.refractiveIndex).toBeCloseTo(1.52946, 4);
    expectClose(dense.optics?.refractiveIndex, index(term), 1e-12);
    // soda-lime glass 1.52: Δn = +0.0095, inside ±0.01, no fringe caution
    expectClose(dense.optics?.mismatch, index(term) - 1.52, 1e-9);
    expect(dense.optics?.substrateIndex).toBe(1.52);
    expect(dense.notices.map((n) => n.code)).not.toContain("index_mismatch_fringes");

    const rhoTh = 1 / (vSi + vTi);
    const porous = computeFormulation({ ...input, measuredBulkDensity: 0.8 * rhoTh });
    expectClose(porous.composite.porosity, 0.2, 1e-12);
    expect(porous.optics?.refractiveIndex).toBeCloseTo(1.40839, 4);
    expectClose(porous.optics?.refractiveIndex, index(0.8 * term), 1e-12);
    // 1.408 against 1.52: Δn = −0.11, fringes on glass
    const fringe = porous.notices.find((n) => n.code === "index_mismatch_fringes");
    expect(fringe?.level).toBe("caution");
    expect(fringe?.field).toBe("substrateId");
  });

  it("counts the bonded ligand as a phase of the coat's index, and names a phase without an index", () => {
    // Visor hard coat (product demo): GPTMS residue 1.49, SiO2 1.4585, TiO2 1.95, bonded acac 1.452 (data/materials.ts).
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
    const phases = result.composite.phases;
    const indices: Record<string, number> = { gptms: 1.49, teos: 1.4585, "ti-isopropoxide": 1.95, acac: 1.452 };
    const term = phases.reduce((sum, p) => sum + p.volumeFraction * LL(indices[p.materialId] as number), 0);
    expect(phases.map((p) => p.materialId).sort()).toEqual(["acac", "gptms", "teos", "ti-isopropoxide"]);
    expectClose(result.optics?.refractiveIndex, Math.sqrt((1 + 2 * term) / (1 - term)), 1e-12);
    // polycarbonate 1.586: this coat is ≈ 1.50, well below → fringes
    expect(result.optics!.mismatch!).toBeLessThan(-0.05);
    expect(result.notices.map((n) => n.code)).toContain("index_mismatch_fringes");

    const noIndex = { ...ref("acac"), refractiveIndex: undefined };
    const missing = computeFormulation({ ...input, materials: input.materials.map((m) => (m.id === "acac" ? noIndex : m)) });
    expect(missing.optics).toBeUndefined();
    const notice = missing.notices.find((n) => n.code === "coat_index_unknown");
    expect(notice?.message).toContain("bonded ligand of Acetylacetone");
    expect(notice?.field).toBe("materials.3.refractiveIndex");
  });

  it("gives the VOC of a TEOS/ethanol sol, the hydrolysis ethanol included, per litre and per litre less water", () => {
    // EU 2004/42/EC: ethanol (bp 78.3 °C ≤ 250 °C) is a VOC; HCl has no carbon and is not.
    // VOC = added ethanol 30.6702 g + hydrolysis ethanol 4 × 0.166436 × 46.069 = 30.6702 g → 61.3405 g
    // per litre of sol: 61.3405 / 0.0880715 L = 696.485 g/L
    // water: (0.660011 added + 0.00573516 carried) mol = 0.665746 mol × 18.015 = 11.9934 g / 0.9982 = 12.0150 mL
    // less water (ASTM D3960, US EPA Method 24): 61.3405 / (0.0880715 − 0.0120150) L = 806.512 g/L
    const result = computeFormulation(teosSol());
    const voc = result.voc!;
    const grams = ethanolG + 4 * nSi * 46.069;
    const waterMl = (4 * nSi * 18.015) / 0.9982;
    expect(voc.massGrams).toBeCloseTo(61.3405, 3);
    expect(voc.gramsPerLitre).toBeCloseTo(696.485, 2);
    expect(voc.gramsPerLitreLessWater).toBeCloseTo(806.512, 2);
    expectClose(voc.massGrams, grams, 1e-12);
    expectClose(voc.waterMl, waterMl, 1e-12);
    expectClose(voc.gramsPerLitre, (grams / solMl) * 1000, 1e-12);
    expectClose(voc.gramsPerLitreLessWater, (grams / (solMl - waterMl)) * 1000, 1e-12);
    expect(result.coating).toBeUndefined();
  });

  it("counts acetic acid and the 1-propanol a zirconium propoxide solution carries, not the modifier", () => {
    // Zr(OPr)4 70 wt% in 1-propanol (30 wt%), w = 1, S = 10 g of dry composite including the bonded acac (chemistry.md, Modifiers):
    // c = 1 × 91.11 / 123.222 = 0.739397 → S_free = 10 / 1.739397 = 5.74912 g ZrO2, n = 5.74912 / 123.222 = 0.0466566 mol;
    // solution 0.0466566 × 327.576 / 0.7 = 21.8337 g carrying 0.3 × 21.8337 = 6.55011 g 1-propanol (bp 97.2 °C);
    // hydrolysis 1-propanol 4 × 0.0466566 × 60.096 = 11.2155 g (groups replaced by acac still release it);
    // acetic acid 0.1 mol/mol Zr = 0.00466566 × 60.052 = 0.280182 g (bp 118 °C). acac: bonded, not counted.
    // VOC = 6.55011 + 11.2155 + 0.280182 = 18.0458 g
    const result = computeFormulation({
      materials: [ref("zr-propoxide-70"), ref("1-propanol"), ref("acac"), ref("water-di"), ref("acetic-acid-glacial")],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "zr-propoxide-70", weightFraction: 1 }],
      modifiers: [{ materialId: "acac", precursorId: "zr-propoxide-70", molPerMetal: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 2 },
      catalyst: { materialId: "acetic-acid-glacial", molPerNetworkAtom: 0.1 },
      steps: [{ name: "Cure", temperatureC: 120, durationH: 1 }],
    });
    const nZr = 10 / (1 + 91.11 / 123.222) / 123.222;
    const expected = 0.3 * ((nZr * 327.576) / 0.7) + 4 * nZr * 60.096 + 0.1 * nZr * 60.052;
    expect(result.voc!.massGrams).toBeCloseTo(18.0458, 3);
    expectClose(result.voc!.massGrams, expected, 1e-12);
  });

  it("gives the epoxy–amine ratio of a GPTMS/APTES coat and cautions outside 0.8–1.2", () => {
    // Lee & Neville, Handbook of Epoxy Resins (1967): eq = mass / EEW or AHEW; GPTMS EEW 236.339, APTES AHEW 110.686.
    // 10 g dry composite, 70 % GPTMS residue (167.2355 g/mol), 30 % APTES residue (110.1875 g/mol):
    // n(GPTMS) = 7 / 167.2355 = 0.0418571 mol → 9.89236 g → 0.0418571 epoxy eq
    // n(APTES) = 3 / 110.1875 = 0.0272263 mol → 6.02717 g → 0.0544527 amine-H eq
    // r = 0.0544527 / 0.0418571 = 1.30092 > 1.2 → caution
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
    const result = computeFormulation(input);
    const nG = 7 / 167.2355;
    const nA = 3 / 110.1875;
    expect(result.cure?.ratio).toBeCloseTo(1.30092, 4);
    expectClose(result.cure?.epoxyEq, (nG * 236.339) / 236.339, 1e-12);
    expectClose(result.cure?.amineHydrogenEq, (nA * 221.372) / 110.686, 1e-12);
    expectClose(result.cure?.ratio, (2 * nA) / nG, 1e-12);
    expect(result.notices.find((n) => n.code === "epoxy_amine_unbalanced")?.level).toBe("caution");

    // Balanced: r = 1 when 2 n(APTES) = n(GPTMS): w_A / w_G = 0.5 × 110.1875 / 167.2355 → w_G = 0.752194, w_A = 0.247806
    const wG = 167.2355 / (167.2355 + 0.5 * 110.1875);
    const balanced = computeFormulation({
      ...input,
      components: [
        { materialId: "gptms", weightFraction: wG },
        { materialId: "aptes", weightFraction: 1 - wG },
      ],
    });
    expectClose(balanced.cure?.ratio, 1, 1e-9);
    expect(balanced.notices.map((n) => n.code)).not.toContain("epoxy_amine_unbalanced");

    // Epoxy alone (GPTMS and TEOS): ratio 0, no caution (nothing to balance yet)
    const alone = computeFormulation(teosSol({ components: [{ materialId: "teos", weightFraction: 0.5 }, { materialId: "gptms", weightFraction: 0.5 }] }, [ref("gptms")]));
    expect(alone.cure?.amineHydrogenEq).toBe(0);
    expect(alone.cure?.ratio).toBe(0);
    expect(alone.notices.map((n) => n.code)).not.toContain("epoxy_amine_unbalanced");
    // No equivalent weight anywhere: no balance at all
    expect(computeFormulation(teosSol()).cure).toBeUndefined();
  });

  it("balances the epoxy resin with the polyetheramine curing agent as organic phases (dry masses)", () => {
    // DGEBA EEW 170.21, polyetheramine AHEW 60 (data/materials.ts): 1 : 1 equivalents at w_E / w_A = 170.21 / 60.
    // With 40 % TEOS silica: w_E = 0.6 × 170.21 / 230.21 = 0.443621, w_A = 0.6 × 60 / 230.21 = 0.156379 → r = 1
    const wE = (0.6 * 170.21) / 230.21;
    const result = computeFormulation(
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
    expectClose(result.cure?.epoxyEq, (wE * 10) / 170.21, 1e-12);
    expectClose(result.cure?.ratio, 1, 1e-9);
  });

  it("gives the cost per batch, per kg dry, per litre and per m², and names the lines without a price", () => {
    // Invented prices (test data): TEOS 40/kg, ethanol 5/kg, water 1/kg, HCl 37 % 12/kg.
    // total = (34.6735 × 40 + 30.6702 × 5 + 11.8901 × 1 + 0.163998 × 12) / 1000 = (1386.94 + 153.351 + 11.8901 + 1.96798) / 1000 = 1.55415
    // per kg dry = 1.55415 / 0.010 kg = 155.415; per litre = 1.55415 / 0.0880715 L = 17.6464
    // wet film 10 µm → 100 m²/L → per m² = 17.6464 / 100 = 0.176464
    const priced = (id: string, price: number): Material => ({ ...ref(id), pricePerKg: price });
    const input = teosSol({ coating: { method: "wetFilm", wetThicknessUm: 10 } });
    input.materials = [priced("teos", 40), priced("ethanol", 5), priced("water-di", 1), priced("hcl-37", 12)];
    const result = computeFormulation(input);
    const total = (nSi * 208.329 * 40 + ethanolG * 5 + addWaterG * 1 + hclStockG * 12) / 1000;
    expect(result.cost?.total).toBeCloseTo(1.55415, 4);
    expectClose(result.cost?.total, total, 1e-12);
    expectClose(result.cost?.perKgDry, total / 0.01, 1e-12);
    expectClose(result.cost?.perLitreSol, total / (solMl / 1000), 1e-12);
    expectClose(result.cost?.perM2, total / (solMl / 1000) / 100, 1e-12);

    input.materials = [priced("teos", 40), ref("ethanol"), priced("water-di", 1), ref("hcl-37")];
    const partial = computeFormulation(input);
    expect(partial.cost).toBeUndefined();
    const notice = partial.notices.find((n) => n.code === "cost_prices_missing");
    expect(notice?.message).toContain("Ethanol, absolute, Hydrochloric acid, 37 wt% have no price");
    expect(notice?.field).toBe("materials.1.pricePerKg");
    // no price anywhere: no cost and nothing said
    const none = computeFormulation(teosSol());
    expect(none.cost).toBeUndefined();
    expect(none.notices.map((n) => n.code)).not.toContain("cost_prices_missing");
  });

  it("keeps the recipe as it was: the coat figures add to a result, they change no amount", () => {
    const plain = computeFormulation(teosSol());
    const coated = computeFormulation(teosSol({ coating: { method: "wetFilm", wetThicknessUm: 5 } }));
    expect(coated.lines).toEqual(plain.lines);
    expect(coated.composite).toEqual(plain.composite);
    expect(line(coated, "teos").massGrams).toBeCloseTo(34.6735, 4);
  });
});

describe("coat predictions: bad input", () => {
  function fieldError(input: FormulationInput): FormulationError {
    try {
      computeFormulation(input);
    } catch (error) {
      if (error instanceof FormulationError) return error;
      throw error;
    }
    throw new Error("no error");
  }

  it("refuses a negative viscosity, naming coating.viscosityMPaS", () => {
    const error = fieldError(teosSol({ coating: { method: "dip", withdrawalMmPerS: 1, viscosityMPaS: -2, surfaceTensionMNPerM: 22 } }));
    expect(error.field).toBe("coating.viscosityMPaS");
    expect(error.message).toBe("sol viscosity (mPa·s) must be between 0.01 and 1000000");
  });

  it("refuses a spin speed of zero, naming coating.rpm", () => {
    const error = fieldError(teosSol({ coating: { method: "spin", rpm: 0, calibration: { rpm: 2000, dryThicknessNm: 300 } } }));
    expect(error.field).toBe("coating.rpm");
    expect(error.message).toMatch(/^spin speed \(rpm\) must be between 1 and/);
  });

  it("refuses a spin coat without its measured film, naming coating.calibration", () => {
    const coating = { method: "spin", rpm: 3000 } as unknown as FormulationInput["coating"];
    const error = fieldError(teosSol({ coating }));
    expect(error.field).toBe("coating.calibration");
    expect(error.message).toMatch(/one measured film/);
  });

  it("refuses a zero calibration speed and an unknown method, each naming its field", () => {
    expect(fieldError(teosSol({ coating: { method: "spin", rpm: 3000, calibration: { rpm: 0, dryThicknessNm: 300 } } })).field).toBe("coating.calibration.rpm");
    const unknown = { method: "brush", wetThicknessUm: 5 } as unknown as FormulationInput["coating"];
    const error = fieldError(teosSol({ coating: unknown }));
    expect(error.field).toBe("coating.method");
    expect(error.message).toMatch(/dip, spin or a wet film/);
  });

  it("refuses water that takes more than the whole sol at the densities given, naming the water's density", () => {
    // 10 g SiO2 from 30 wt% colloidal silica (1.21 g/cm³): 33.333 g = 27.548 mL carrying 23.333 g water.
    // A water material at 0.5 g/cm³ would put that water at 46.667 mL, more than the sol: inconsistent densities.
    const water = { ...ref("water-di"), density: 0.5 };
    const error = fieldError({
      materials: [ref("colloidal-silica-30"), water],
      basis: { type: "solidMass", grams: 10 },
      components: [{ materialId: "colloidal-silica-30", weightFraction: 1 }],
      water: { materialId: "water-di", ratio: "R", value: 4 },
      steps: [{ name: "Dry", temperatureC: 60, durationH: 1 }],
    });
    expect(error.field).toBe("materials.1.density");
    expect(error.message).toMatch(/takes up the whole sol volume/);
  });
});
