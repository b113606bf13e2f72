/**
 * The materials of a numeric model, indexed once: per material the plain
 * numbers every point needs (reciprocals of molar masses, densities and
 * assays, carried water per gram, residue yields, organic shares), so that a
 * point does no look-up beyond one id → position map.
 *
 * An absent property is NaN; the point that needs it refuses with the code
 * and field the decimal engine throws (lib/formulation/material-index.ts).
 */
import { WATER_MOLAR_MASS_G_PER_MOL } from "../constants";
import { isFormulationError } from "../errors";
import type { Material, PrecursorData } from "../material-schema";
import { organicShareOfResidue } from "./figures";
import { refuse } from "./refusal";
import { thermalProfile, type ThermalProfile } from "./thermal";

/** One material's constants, plain float64 (units in the names; NaN where the material has none). */
export interface TableMaterial {
  readonly material: Material;
  readonly id: string;
  /** "materials.N" */
  readonly path: string;
  readonly molarMass: number;
  readonly density: number;
  /** 1 / ρ, cm³/g (NaN without a density). */
  readonly perDensity: number;
  /** 1 / assay (1 when the assay is absent or 1). */
  readonly perAssay: number;
  /** mol of carried water per g as supplied: waterFraction / 18.015. */
  readonly waterMolPerGram: number;
  /** g of carried solvent per g as supplied. */
  readonly solventFraction: number;
  /** Position of the material named by solventId, −1 when none (or not in the list). */
  readonly solventIndex: number;
  /** Water of crystallisation per formula unit. */
  readonly crystalWater: number;
  readonly precursor: PrecursorData | undefined;
  /** mol precursor per g residue: 1 / (k · M_res). */
  readonly molPerResidueGram: number;
  /** Position of the leaving alcohol among the model's distinct alcohols, −1 when none. */
  readonly alcoholSlot: number;
  /** g/cm³ of the dry organic phase (NaN when the engine would refuse; see phaseDensityField). */
  readonly phaseDensity: number;
  /** The field the engine names when the dry-phase density is missing, "" when it is known. */
  readonly phaseDensityField: string;
  /** Organic share of the material's phase in the dry composite (figures.ts organicShares). */
  readonly organicShare: number;
  /** Thermal limits of an organic phase or a substrate, undefined for other kinds. */
  readonly thermal: ThermalProfile | undefined;
}

/** The materials of a model: by position, by id, and the distinct leaving alcohols. */
export interface MaterialTable {
  readonly materials: readonly TableMaterial[];
  readonly indexOf: ReadonlyMap<string, number>;
  readonly byId: ReadonlyMap<string, Material>;
  /** Distinct leaving alcohols (name and molar mass), as the engine keys them. */
  readonly alcohols: readonly { name: string; molarMass: number }[];
  /**
   * The refusal every point gets when a precursor's residue formula "(R)…" cannot be read: the decimal
   * model reads the organic shares of all materials (figures.ts organicShares) after computing a point.
   */
  readonly formulaRefusal: { code: string; field: string } | undefined;
}

const orNaN = (value: number | undefined): number => (value === undefined ? Number.NaN : value);

function phaseDensityOf(material: Material, path: string): { value: number; field: string } {
  if (material.kind !== "organic") return { value: Number.NaN, field: "" };
  if (material.phaseDensity !== undefined) return { value: material.phaseDensity, field: "" };
  if ((material.assay ?? 1) === 1) {
    return material.density === undefined ? { value: Number.NaN, field: `${path}.density` } : { value: material.density, field: "" };
  }
  return { value: Number.NaN, field: `${path}.phaseDensity` };
}

function organicShareOf(material: Material, refusals: { code: string; field: string }[]): number {
  if (material.kind === "organic" || material.kind === "modifier") return 1;
  if (material.kind === "precursor" && material.precursor) {
    try {
      return organicShareOfResidue(material.precursor.residueFormula);
    } catch (error) {
      if (!isFormulationError(error)) throw error;
      refusals.push({ code: error.code, field: error.field });
      return Number.NaN;
    }
  }
  return 0;
}

/**
 * Indexes materials once for the numeric path (the first of a duplicated id wins, as in the engine).
 *
 * @param materials - the materials every point of the model uses
 * @returns the table
 * @example
 * ```ts
 * const table = materialTable([teos, ethanol, waterDi]);
 * table.materials[table.indexOf.get("teos")!]!.molPerResidueGram; // 1 / 60.083 mol/g
 * ```
 */
export function materialTable(materials: readonly Material[]): MaterialTable {
  const indexOf = new Map<string, number>();
  const byId = new Map<string, Material>();
  materials.forEach((material, index) => {
    if (!indexOf.has(material.id)) {
      indexOf.set(material.id, index);
      byId.set(material.id, material);
    }
  });
  const alcohols: { name: string; molarMass: number }[] = [];
  const alcoholKeys = new Map<string, number>();
  const refusals: { code: string; field: string }[] = [];
  const table = materials.map((material, index): TableMaterial => {
    const path = `materials.${index}`;
    const p = material.precursor;
    let alcoholSlot = -1;
    if (p?.leavingAlcohol) {
      const key = `${p.leavingAlcohol.name}|${p.leavingAlcohol.molarMass}`;
      alcoholSlot = alcoholKeys.get(key) ?? -1;
      if (alcoholSlot < 0) {
        alcoholSlot = alcohols.length;
        alcoholKeys.set(key, alcoholSlot);
        alcohols.push({ name: p.leavingAlcohol.name, molarMass: p.leavingAlcohol.molarMass });
      }
    }
    const phase = phaseDensityOf(material, path);
    return {
      material,
      id: material.id,
      path,
      molarMass: orNaN(material.molarMass),
      density: orNaN(material.density),
      perDensity: material.density === undefined ? Number.NaN : 1 / material.density,
      perAssay: material.assay === undefined || material.assay === 1 ? 1 : 1 / material.assay,
      waterMolPerGram: material.waterFraction ? material.waterFraction / WATER_MOLAR_MASS_G_PER_MOL : 0,
      solventFraction: material.solventFraction ?? 0,
      solventIndex: material.solventId === undefined ? -1 : (indexOf.get(material.solventId) ?? -1),
      crystalWater: material.crystalWaterPerFormula ?? 0,
      precursor: p,
      molPerResidueGram: p ? 1 / (p.residuePerMolecule * p.residueMolarMass) : Number.NaN,
      alcoholSlot,
      phaseDensity: phase.value,
      phaseDensityField: phase.field,
      organicShare: organicShareOf(material, refusals),
      thermal: material.kind === "organic" || material.kind === "substrate" ? thermalProfile(material) : undefined,
    };
  });
  return { materials: table, indexOf, byId, alcohols, formulaRefusal: refusals[0] };
}

/**
 * mL of `grams` of a material as supplied; refuses "missing_density" on materials.N.density like the engine's volumeOf.
 *
 * @example
 * ```ts
 * volumeMl(ethanolRow, 78.93); // ≈ 100 mL
 * ```
 */
export function volumeMl(m: TableMaterial, grams: number): number {
  if (Number.isNaN(m.perDensity)) refuse("missing_density", `${m.path}.density`);
  return m.density === 1 ? grams : grams * m.perDensity;
}

/**
 * The molar mass of a material, g/mol; refuses "missing_molar_mass" on materials.N.molarMass like requireMolarMass.
 *
 * @example
 * ```ts
 * molarMassOfRow(teosRow); // 208.329
 * ```
 */
export function molarMassOfRow(m: TableMaterial): number {
  if (Number.isNaN(m.molarMass)) refuse("missing_molar_mass", `${m.path}.molarMass`);
  return m.molarMass;
}

/**
 * The position of a material id in the table (the input was validated, so it is there).
 *
 * @example
 * ```ts
 * positionOf(table, "teos"); // 0
 * ```
 */
export function positionOf(table: MaterialTable, id: string, field: string): number {
  const index = table.indexOf.get(id);
  if (index === undefined) refuse("unknown_material", field);
  return index;
}
