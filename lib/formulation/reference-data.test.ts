import { MF } from "mf-parser";
import { describe, expect, it } from "vitest";
import { ATOMIC_WEIGHTS } from "@/data/atomic-weights";
import { referenceMaterials } from "@/data/materials";
import { parseFormula } from "./formula";
import { casCheckDigitValid, materialSchema, type Material } from "./material-schema";

/**
 * Our own molar-mass sum over IUPAC/CIAAW 2021 abridged atomic weights
 * (data/atomic-weights.ts), written here with plain numbers so that it does
 * not reuse the engine's decimal code.
 */
function ownMolarMass(formula: string): number {
  let mass = 0;
  for (const [symbol, count] of Object.entries(parseFormula(formula))) {
    const weight = ATOMIC_WEIGHTS[symbol];
    if (weight === undefined) throw new Error(`no atomic weight for ${symbol}`);
    mass += count * weight;
  }
  return mass;
}

/** Molar mass from mf-parser (npm, cheminfo), which ships its own element table. */
function mfParserMass(formula: string): number {
  return (new MF(formula.replace(/·/g, " . ")).getInfo() as { mass: number }).mass;
}

/** Tolerance for molar masses, g/mol (issue requirement). */
const MOLAR_MASS_TOLERANCE = 0.01;

/** Formulas of the alcohols released by hydrolysis (IUPAC names, common practice, no source). */
const ALCOHOL_FORMULAS: Record<string, string> = {
  methanol: "CH4O",
  ethanol: "C2H6O",
  "1-propanol": "C3H8O",
  "2-propanol": "C3H8O",
  "1-butanol": "C4H10O",
  "2-butanol": "C4H10O",
};

const byId = new Map(referenceMaterials.map((material) => [material.id, material]));
function material(id: string): Material {
  const found = byId.get(id);
  if (!found) throw new Error(`missing reference material ${id}`);
  return found;
}

const withMolarMass = referenceMaterials.filter((m) => m.molarMass !== undefined && m.formula !== undefined);
const precursors = referenceMaterials.filter((m) => m.kind === "precursor");

describe("reference materials", () => {
  it("returns valid materials for the shared schema", () => {
    for (const m of referenceMaterials) {
      const parsed = materialSchema.safeParse(m);
      expect(parsed.success, `${m.id}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
    }
  });

  it("has unique ids and the ids other parts of the product rely on", () => {
    expect(new Set(referenceMaterials.map((m) => m.id)).size).toBe(referenceMaterials.length);
    for (const id of [
      "teos", "tmos", "mtes", "mtms", "gptms", "maptms", "aptes", "vtes", "ti-isopropoxide", "ti-butoxide",
      "zr-propoxide-70", "al-sec-butoxide", "triethyl-phosphate", "ca-nitrate-4h2o",
      "peg-2000", "pva", "pva-10-aq", "pcl", "pdms-silanol", "chitosan", "gelatin", "epoxy-dgeba", "pmma",
      "polycarbonate", "pmma-sheet", "peek", "pet", "pla", "uhmwpe", "aluminium-6061", "soda-lime-glass",
      "ethanol", "methanol", "1-propanol", "2-propanol", "1-butanol", "water-di",
      "hcl-37", "hno3-65", "acetic-acid-glacial", "ammonia-25",
      "acac", "ethyl-acetoacetate", "methacrylic-acid", "colloidal-silica-30", "ethyl-silicate-40", "1-methoxy-2-propanol",
    ]) {
      expect(byId.has(id), id).toBe(true);
    }
  });

  it("has at least 10 precursors, 8 organic phases and 8 substrates", () => {
    const count = (kind: Material["kind"]): number => referenceMaterials.filter((m) => m.kind === kind).length;
    expect(count("precursor")).toBeGreaterThanOrEqual(10);
    expect(count("organic")).toBeGreaterThanOrEqual(8);
    expect(count("substrate")).toBeGreaterThanOrEqual(8);
    expect(count("solvent")).toBeGreaterThanOrEqual(5);
    expect(count("water")).toBeGreaterThanOrEqual(1);
    expect(count("catalyst")).toBeGreaterThanOrEqual(4);
  });

  it("names a source for every property it sets", () => {
    for (const m of referenceMaterials) {
      const sources = m.sources ?? {};
      const paths: string[] = [];
      for (const [key, value] of Object.entries(m)) {
        if (value === undefined || ["id", "name", "kind", "sources"].includes(key)) continue;
        if (key === "precursor" || key === "thermal" || key === "modifier") {
          for (const [inner, innerValue] of Object.entries(value as object)) if (innerValue !== undefined) paths.push(`${key}.${inner}`);
        } else paths.push(key);
      }
      for (const path of paths) {
        expect(sources[path], `${m.id}: no source for ${path}`).toMatch(/\S/);
      }
    }
  });

  it("lists GHS hazard statements and defers to the supplier's safety data sheet", () => {
    for (const m of referenceMaterials) {
      expect(Array.isArray(m.hazards), m.id).toBe(true);
      for (const code of m.hazards ?? []) expect(code).toMatch(/^(EUH|H)\d{3}[A-Za-z]{0,2}$/);
      if ((m.hazards ?? []).length > 0) expect(m.sources?.hazards, m.id).toMatch(/safety data sheet/);
    }
    // UN GHS: tetramethoxysilane is fatal if inhaled (H330) and causes serious eye damage (H318) — from memory.
    expect(material("tmos").hazards).toEqual(expect.arrayContaining(["H330", "H318"]));
    // UN GHS: hydrochloric acid and aqueous ammonia cause severe skin burns (H314) — from memory.
    expect(material("hcl-37").hazards).toContain("H314");
    expect(material("ammonia-25").hazards).toContain("H314");
  });

  it("has CAS numbers whose check digit is right", () => {
    // CAS Registry Number check digit: Σ digit × position from the right, mod 10 (published CAS algorithm).
    // Water 7732-18-5: 8·1 + 1·2 + 2·3 + 3·4 + 7·5 + 7·6 = 105 → 5 (by hand).
    expect(casCheckDigitValid("7732-18-5")).toBe(true);
    expect(casCheckDigitValid("7732-18-4")).toBe(false);
    for (const m of referenceMaterials) {
      if (m.casNumber) expect(casCheckDigitValid(m.casNumber), `${m.id} ${m.casNumber}`).toBe(true);
    }
  });
});

describe("molar masses in data/", () => {
  it.each(withMolarMass.map((m) => [m.id, m] as const))(
    "%s: molar mass recomputed from its formula with CIAAW 2021 within 0.01 g/mol",
    (_id, m) => {
      // IUPAC/CIAAW 2021 standard atomic weights, abridged values (data/atomic-weights.ts)
      expect(Math.abs(ownMolarMass(m.formula as string) - (m.molarMass as number))).toBeLessThan(MOLAR_MASS_TOLERANCE);
      // cross-check with mf-parser from npm
      expect(Math.abs(mfParserMass(m.formula as string) - (m.molarMass as number))).toBeLessThan(MOLAR_MASS_TOLERANCE);
    },
  );

  it.each(precursors.map((m) => [m.id, m] as const))("%s: residue molar mass recomputed from its formula", (_id, m) => {
    const data = m.precursor;
    expect(data).toBeDefined();
    if (!data) return;
    expect(Math.abs(ownMolarMass(data.residueFormula) - data.residueMolarMass)).toBeLessThan(MOLAR_MASS_TOLERANCE);
    expect(Math.abs(mfParserMass(data.residueFormula) - data.residueMolarMass)).toBeLessThan(MOLAR_MASS_TOLERANCE);
  });

  it("has leaving-alcohol molar masses that match their formulas", () => {
    for (const m of precursors) {
      const alcohol = m.precursor?.leavingAlcohol;
      if (!alcohol) continue;
      const formula = ALCOHOL_FORMULAS[alcohol.name];
      expect(formula, `${m.id}: unknown alcohol ${alcohol.name}`).toBeDefined();
      expect(Math.abs(mfParserMass(formula as string) - alcohol.molarMass)).toBeLessThan(MOLAR_MASS_TOLERANCE);
    }
  });

  it("includes the water of crystallisation of calcium nitrate tetrahydrate in its molar mass", () => {
    const hydrate = material("ca-nitrate-4h2o");
    expect(hydrate.crystalWaterPerFormula).toBe(4);
    // Ca(NO3)2 164.086 + 4 × 18.015 = 236.146 g/mol (CIAAW 2021 abridged, by hand:
    // 40.078 + 2 × 14.007 + 6 × 15.999 = 164.086)
    expect(hydrate.molarMass).toBeCloseTo(164.086 + 4 * 18.015, 3);
  });
});

describe("residue stoichiometry", () => {
  /**
   * Net reaction of an alkoxide, Brinker & Scherer, Sol-Gel Science (1990), ch. 3:
   * M(OR)z + z/2 H2O → MOz/2 + z ROH, and R'-Si(OR)3 → R'-SiO1.5. So the residue per
   * molecule (k × residue formula) = precursor − g × (OR) + (g/2) × O, element by element.
   */
  it.each(precursors.filter((m) => m.precursor?.leavingAlcohol).map((m) => [m.id, m] as const))(
    "%s: residue balances the net hydrolysis–condensation reaction",
    (_id, m) => {
      const data = m.precursor;
      if (!data?.leavingAlcohol) throw new Error("no alkoxide data");
      const alcohol = parseFormula(ALCOHOL_FORMULAS[data.leavingAlcohol.name] as string);
      const alkoxy: Record<string, number> = { ...alcohol, H: (alcohol.H ?? 0) - 1 }; // OR = ROH − H
      const expected: Record<string, number> = { ...parseFormula(m.formula as string) };
      const g = data.hydrolysableGroupsPerMolecule;
      for (const [symbol, count] of Object.entries(alkoxy)) expected[symbol] = (expected[symbol] ?? 0) - g * count;
      expected.O = (expected.O ?? 0) + g / 2;
      const residue = parseFormula(data.residueFormula);
      const symbols = new Set([...Object.keys(expected), ...Object.keys(residue)]);
      for (const symbol of symbols) {
        expect((residue[symbol] ?? 0) * data.residuePerMolecule, `${m.id} ${symbol}`).toBeCloseTo(expected[symbol] ?? 0, 10);
      }
    },
  );

  it("counts one network-forming atom per molecule for Si, Ti, Zr, Al and P precursors", () => {
    for (const m of precursors) {
      const atoms = parseFormula(m.formula as string);
      const formers = (atoms.Si ?? 0) + (atoms.Ti ?? 0) + (atoms.Zr ?? 0) + (atoms.Al ?? 0) + (atoms.P ?? 0);
      expect(m.precursor?.networkAtomsPerMolecule, m.id).toBe(formers);
    }
  });

  it("gives calcium nitrate a CaO residue and a nitrate-decomposition conversion temperature", () => {
    const data = material("ca-nitrate-4h2o").precursor;
    expect(data?.residueFormula).toBe("CaO");
    // Nitrate decomposition is complete at about 600 °C in the usual 58S route (from memory).
    expect(data?.conversionTemperatureC).toBeGreaterThanOrEqual(550);
    expect(data?.conversionTemperatureC).toBeLessThanOrEqual(650);
  });

  it("computes organically modified silane residues as R-SiO1.5", () => {
    // GPTMS C9H20O5Si (236.34 g/mol): R = glycidoxypropyl C6H11O2, residue C6H11O3.5Si:
    // 6 × 12.011 + 11 × 1.008 + 3.5 × 15.999 + 28.085 = 72.066 + 11.088 + 55.9965 + 28.085 = 167.2355 g/mol (by hand)
    const gptms = material("gptms");
    expect(gptms.precursor?.residueMolarMass).toBeCloseTo(167.2355, 4);
    expect(gptms.precursor?.hydrolysableGroupsPerMolecule).toBe(3);
    expect(gptms.precursor?.networkAtomsPerMolecule).toBe(1);
  });
});

describe("densities and stocks in data/", () => {
  /** Handbook values cited in data/materials.ts (g/cm³ at 20–25 °C), tolerance 0.002. */
  const HANDBOOK_DENSITIES: [string, number, string][] = [
    ["teos", 0.933, "CRC Handbook, tetraethyl silicate, 20 °C"],
    ["ethanol", 0.7893, "CRC Handbook, 20 °C"],
    ["methanol", 0.7914, "CRC Handbook, 20 °C"],
    ["1-propanol", 0.8035, "CRC Handbook, 20 °C"],
    ["2-propanol", 0.7855, "CRC Handbook, 20 °C"],
    ["1-butanol", 0.8095, "CRC Handbook, 20 °C"],
    ["acetic-acid-glacial", 1.049, "CRC Handbook, 20 °C"],
  ];

  it.each(HANDBOOK_DENSITIES)("%s matches the handbook density %s g/cm³ (%s)", (id, expected) => {
    expect(Math.abs((material(id).density as number) - expected)).toBeLessThan(0.002);
  });

  it("gives water the density of the Kell (1975) equation at 20 °C", () => {
    // Kell, J. Chem. Eng. Data 20 (1975) 97: ρ(t) in kg/m³ (coefficients from memory).
    const t = 20;
    const kell =
      (999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5) /
      (1 + 16.87985e-3 * t);
    expect(kell / 1000).toBeCloseTo(0.9982, 4);
    expect(Math.abs((material("water-di").density as number) - kell / 1000)).toBeLessThan(1e-4);
  });

  it("uses the CRC fused-silica density 2.20 g/cm³ for SiO2 residues", () => {
    // CRC Handbook: fused (amorphous) silica ≈ 2.20 g/cm³, as the formulation chemistry states.
    expect(material("teos").precursor?.residueDensity).toBe(2.2);
    expect(material("tmos").precursor?.residueDensity).toBe(2.2);
  });

  it("makes aqueous catalyst stocks carry water = 1 − assay", () => {
    for (const id of ["hcl-37", "hno3-65", "ammonia-25"]) {
      const stock = material(id);
      expect((stock.assay as number) + (stock.waterFraction as number), id).toBeCloseTo(1, 12);
    }
    // nominal stock concentrations, common practice, no source
    expect(material("hcl-37").assay).toBe(0.37);
    expect(material("hno3-65").assay).toBe(0.65);
    expect(material("ammonia-25").assay).toBe(0.25);
  });

  it("gives the aqueous PVA solution the dry PVA density as its phase density", () => {
    const solution = material("pva-10-aq");
    expect(solution.assay).toBe(0.1);
    expect(solution.waterFraction).toBe(0.9);
    expect(solution.phaseDensity).toBe(material("pva").density);
  });

  it("carries 30 wt% 1-propanol in the zirconium propoxide solution", () => {
    const zr = material("zr-propoxide-70");
    expect(zr.assay).toBe(0.7);
    expect(zr.solventFraction).toBeCloseTo(0.3, 12);
  });
});

describe("reference modifiers", () => {
  const modifiers = referenceMaterials.filter((m) => m.kind === "modifier");

  it("ships acetylacetone, ethyl acetoacetate and methacrylic acid", () => {
    expect(modifiers.map((m) => m.id).sort()).toEqual(["acac", "ethyl-acetoacetate", "methacrylic-acid"]);
  });

  it.each(modifiers.map((m) => [m.id, m] as const))("%s: bonded ligand = anion less half an oxygen, molar mass from its formula", (_id, m) => {
    // The ligand LH loses H when it bonds (anion L⁻) and the oxide gives up O½ per ligand (chemistry.md, "Modifiers"):
    // acac C5H8O2 → C5H7O2 − O0.5 = C5H7O1.5, 99.109 − 7.9995 = 91.11 g/mol (by hand, CIAAW 2021 abridged).
    const data = m.modifier!;
    const ligand = parseFormula(m.formula as string);
    const expected: Record<string, number> = { ...ligand, H: (ligand.H ?? 0) - 1, O: (ligand.O ?? 0) - 0.5 };
    const bonded = parseFormula(data.bondedFormula);
    for (const symbol of new Set([...Object.keys(expected), ...Object.keys(bonded)])) {
      expect(bonded[symbol] ?? 0, `${m.id} ${symbol}`).toBeCloseTo(expected[symbol] ?? 0, 10);
    }
    expect(Math.abs(ownMolarMass(data.bondedFormula) - data.bondedMolarMass)).toBeLessThanOrEqual(MOLAR_MASS_TOLERANCE);
    expect(data.groupsReplacedPerMolecule).toBe(1);
  });

  it("gives acac the 91.11 g/mol of chemistry.md", () => {
    expect(material("acac").modifier?.bondedMolarMass).toBeCloseTo(91.11, 2);
  });

  it("flags the Ti, Zr and Al alkoxides as fast-hydrolysing and not the silicon ones", () => {
    // Livage, Henry & Sanchez, Prog. Solid State Chem. 18 (1988) 259.
    for (const id of ["ti-isopropoxide", "ti-butoxide", "zr-propoxide-70", "al-sec-butoxide"]) expect(material(id).fastHydrolysing, id).toBe(true);
    for (const id of ["teos", "tmos", "gptms"]) expect(material(id).fastHydrolysing, id).toBeUndefined();
  });
});


describe("reference data for the coat predictions", () => {
  it("gives GPTMS its molar mass as EEW, APTES half its molar mass as AHEW, DGEBA half its molar mass as EEW", () => {
    // chemistry.md, "What the coat will be"; Lee & Neville, Handbook of Epoxy Resins (1967): one epoxy per GPTMS,
    // two amine hydrogens per APTES (221.37 / 2 = 110.69 g/eq), two glycidyl groups per DGEBA monomer (340.42 / 2 = 170.21).
    expect(material("gptms").epoxyEquivalentWeight).toBe(material("gptms").molarMass);
    expect(material("gptms").epoxyEquivalentWeight).toBeCloseTo(236.34, 2);
    expect(material("aptes").amineHydrogenEquivalentWeight).toBeCloseTo((material("aptes").molarMass as number) / 2, 3);
    expect(material("aptes").amineHydrogenEquivalentWeight).toBeCloseTo(110.69, 2);
    expect(material("epoxy-dgeba").epoxyEquivalentWeight).toBeCloseTo(ownMolarMass("C21H24O4") / 2, 2);
  });

  it("ships an amine curing agent as an organic phase, AHEW about 60 g/eq", () => {
    // Poly(propylene glycol) bis(2-aminopropyl ether), Mn ≈ 230: four amine hydrogens → ≈ 57.5 g/eq; data sheets say ≈ 60 (from memory).
    const amine = material("polyetheramine-230");
    expect(amine.kind).toBe("organic");
    expect(amine.amineHydrogenEquivalentWeight).toBeGreaterThanOrEqual(55);
    expect(amine.amineHydrogenEquivalentWeight).toBeLessThanOrEqual(65);
    expect(amine.epoxyEquivalentWeight).toBeUndefined();
  });

  it("gives every precursor a residue refractive index, amorphous and below the crystalline values", () => {
    // Crystalline n_D (CRC Handbook, from memory): anatase ≈ 2.49, monoclinic zirconia ≈ 2.15, corundum 1.768.
    // Fused silica 1.4585 (Malitson, J. Opt. Soc. Am. 55 (1965) 1205, from memory).
    for (const m of precursors) expect(m.precursor?.residueRefractiveIndex, m.id).toBeGreaterThan(1.3);
    expect(material("teos").precursor?.residueRefractiveIndex).toBeCloseTo(1.4585, 4);
    for (const id of ["ti-isopropoxide", "ti-butoxide"]) {
      const n = material(id).precursor?.residueRefractiveIndex as number;
      expect(n, id).toBeGreaterThanOrEqual(1.9);
      expect(n, id).toBeLessThanOrEqual(2.1);
    }
    expect(material("zr-propoxide-70").precursor?.residueRefractiveIndex).toBeLessThan(2.15);
    expect(material("al-sec-butoxide").precursor?.residueRefractiveIndex).toBeLessThan(1.768);
    // R-SiO1.5 units of the organosilanes ≈ 1.42–1.50 (from memory)
    for (const id of ["mtes", "mtms", "gptms", "maptms", "aptes", "vtes"]) {
      const n = material(id).precursor?.residueRefractiveIndex as number;
      expect(n, id).toBeGreaterThanOrEqual(1.42);
      expect(n, id).toBeLessThanOrEqual(1.5);
    }
  });

  it("gives the transparent substrates their index and the opaque ones none", () => {
    // Polymer Handbook (from memory): polycarbonate 1.586, PMMA 1.49; soda-lime glass ≈ 1.52; oriented PET 1.57–1.65.
    expect(material("polycarbonate").refractiveIndex).toBe(1.586);
    expect(material("pmma-sheet").refractiveIndex).toBeCloseTo(1.49, 2);
    expect(material("soda-lime-glass").refractiveIndex).toBeCloseTo(1.52, 2);
    const pet = material("pet").refractiveIndex as number;
    expect(pet).toBeGreaterThanOrEqual(1.57);
    expect(pet).toBeLessThanOrEqual(1.65);
    for (const id of ["peek", "uhmwpe", "aluminium-6061"]) expect(material(id).refractiveIndex, id).toBeUndefined();
  });

  it("gives every organic phase and modifier a refractive index", () => {
    for (const m of referenceMaterials.filter((x) => x.kind === "organic" || x.kind === "modifier")) {
      expect(m.refractiveIndex, m.id).toBeGreaterThan(1.3);
      expect(m.refractiveIndex, m.id).toBeLessThan(1.7);
    }
  });

  it("gives the solvents, the organic catalyst and the modifiers their boiling points, all volatile (≤ 250 °C)", () => {
    // CRC Handbook, normal boiling points (from memory): ethanol 78.3, methanol 64.7, 2-propanol 82.3, 1-butanol 117.7 °C.
    expect(material("ethanol").boilingPointC).toBeCloseTo(78.3, 1);
    expect(material("methanol").boilingPointC).toBeCloseTo(64.7, 1);
    for (const m of referenceMaterials.filter((x) => x.kind === "solvent" || x.kind === "modifier" || x.id === "acetic-acid-glacial")) {
      expect(m.boilingPointC, m.id).toBeGreaterThan(50);
      expect(m.boilingPointC, m.id).toBeLessThanOrEqual(250);
    }
  });

  it("leaves prices to the teams (the reference data has none)", () => {
    for (const m of referenceMaterials) expect(m.pricePerKg, m.id).toBeUndefined();
  });
});
