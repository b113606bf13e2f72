import { MF } from "mf-parser";
import { describe, expect, it } from "vitest";
import { FormulationError } from "./errors";
import { molarMassOf, parseFormula } from "./formula";

/** Molar mass from the general-purpose npm library mf-parser (its own element table). */
function mfParserMass(formula: string): number {
  const info = new MF(formula.replace(/·/g, " . ")).getInfo() as { mass: number };
  return info.mass;
}

describe("parseFormula", () => {
  it("returns element counts with nested groups", () => {
    // Si(OC2H5)4: Si 1, O 4, C 2·4 = 8, H 5·4 = 20 (by hand)
    expect(parseFormula("Si(OC2H5)4")).toEqual({ Si: 1, O: 4, C: 8, H: 20 });
  });

  it("returns fractional counts of residue units", () => {
    // (C6H11O2)SiO1.5: O = 2 + 1.5 = 3.5 (by hand)
    expect(parseFormula("(C6H11O2)SiO1.5")).toEqual({ C: 6, H: 11, O: 3.5, Si: 1 });
  });

  it("returns counts of a hydrate with a leading coefficient", () => {
    // Ca(NO3)2·4H2O: N 2, O 6 + 4 = 10, H 8 (by hand)
    expect(parseFormula("Ca(NO3)2·4H2O")).toEqual({ Ca: 1, N: 2, O: 10, H: 8 });
  });

  describe("edge cases", () => {
    it.each(["", "Xx2", "Si(OC2H5", "SiO2)", "si", "2·"])("throws invalid_formula for %j", (formula) => {
      expect(() => parseFormula(formula)).toThrow(FormulationError);
      try {
        parseFormula(formula, "materials.0.formula");
      } catch (error) {
        expect((error as FormulationError).code).toBe("invalid_formula");
        expect((error as FormulationError).field).toBe("materials.0.formula");
      }
    });
  });
});

describe("molarMassOf", () => {
  it("returns the molar mass of SiO2 from CIAAW 2021 abridged weights", () => {
    // IUPAC/CIAAW 2021 abridged: Si 28.085, O 15.999 → 28.085 + 2 × 15.999 = 60.083 g/mol (by hand)
    expect(molarMassOf("SiO2")).toBeCloseTo(60.083, 10);
  });

  it("returns the molar mass of TEOS as commonly tabulated", () => {
    // C8H20O4Si: 8 × 12.011 + 20 × 1.008 + 4 × 15.999 + 28.085 = 96.088 + 20.16 + 63.996 + 28.085 = 208.329 (by hand);
    // CRC Handbook lists tetraethyl silicate at 208.33 g/mol.
    expect(molarMassOf("Si(OC2H5)4")).toBeCloseTo(208.329, 10);
    expect(molarMassOf("Si(OC2H5)4")).toBeCloseTo(208.33, 2);
  });

  it("agrees with mf-parser within 0.01 g/mol on sample formulas", () => {
    // mf-parser (npm, cheminfo) uses its own element table; agreement within 0.01 g/mol is expected.
    for (const formula of ["H2O", "Ca(NO3)2·4H2O", "Ti(OC3H7)4", "(C2H5O)3PO", "Al2O3", "(CH3)SiO1.5"]) {
      expect(Math.abs(molarMassOf(formula) - mfParserMass(formula))).toBeLessThan(0.01);
    }
  });
});
