/**
 * Per-material constants of the numeric coat figures, computed once per
 * Material object (a WeakMap, as voc.ts keeps its verdicts): whether the
 * material counts toward VOC, its assay factor, the reciprocals of its
 * epoxy and amine-hydrogen equivalent weights, its price and the
 * Lorentz–Lorenz term of the phase it leaves in the dry coat.
 */
import type { Material } from "../material-schema";
import { phaseIndex } from "../optics";
import { vocVerdict } from "../voc";

/** The constants of one material the coat figures use (plain numbers). */
export interface CoatMaterialData {
  /** True when the material counts toward VOC (verdict "yes" or "assumed", EU 2004/42/EC). */
  volatile: boolean;
  /** Factor from mass as supplied to active mass: 1 without an assay, 0 for an assay of 0 (as timesFactor). */
  assayFactor: number;
  /** True when the material has an epoxy or an amine-hydrogen equivalent weight. */
  curing: boolean;
  /** 1 / EEW, eq/g (0 without one). */
  epoxyPerGram: number;
  /** 1 / AHEW, eq/g (0 without one). */
  aminePerGram: number;
  /** Price per kg in the team's currency, NaN without one. */
  pricePerKg: number;
  /** (n² − 1)/(n² + 2) of the phase the material leaves in the dry coat; NaN when it has no index. */
  lorentzLorenzTerm: number;
}

const cache = new WeakMap<Material, CoatMaterialData>();

/**
 * The Lorentz–Lorenz term of a refractive index, (n² − 1)/(n² + 2),
 * dimensionless (Born & Wolf, Principles of Optics).
 *
 * @example
 * ```ts
 * lorentzLorenz(1.5); // 1.25 / 4.25 = 0.2941…
 * ```
 */
export function lorentzLorenz(n: number): number {
  const square = n * n;
  return (square - 1) / (square + 2);
}

/**
 * The coat constants of a material, memoised per Material object.
 *
 * @param material - a material of the formulation
 * @returns its constants for the coat figures
 * @example
 * ```ts
 * coatMaterialData(ethanol).volatile; // true (C2H6O, bp 78.3 °C)
 * coatMaterialData(gptms).epoxyPerGram; // 1 / 236.339 eq/g
 * ```
 */
export function coatMaterialData(material: Material): CoatMaterialData {
  let data = cache.get(material);
  if (data !== undefined) return data;
  const { assay, epoxyEquivalentWeight: eew, amineHydrogenEquivalentWeight: ahew } = material;
  const index = phaseIndex(material);
  data = {
    volatile: vocVerdict(material) !== "no",
    assayFactor: assay === undefined ? 1 : assay,
    curing: eew !== undefined || ahew !== undefined,
    epoxyPerGram: eew === undefined ? 0 : 1 / eew,
    aminePerGram: ahew === undefined ? 0 : 1 / ahew,
    pricePerKg: material.pricePerKg === undefined ? Number.NaN : material.pricePerKg,
    lorentzLorenzTerm: index === undefined ? Number.NaN : lorentzLorenz(index),
  };
  cache.set(material, data);
  return data;
}

const paths = new WeakMap<ReadonlyMap<string, Material>, Map<string, string>>();

/**
 * The error path of a material, "materials.N", N its position in the
 * materials list. The list is read from the order of `byId`, which is built
 * from the list in order (as indexMaterials does; the input schema refuses
 * duplicate ids). Memoised per map.
 *
 * @example
 * ```ts
 * materialPath(byId, "water-di"); // "materials.1"
 * ```
 */
export function materialPath(byId: ReadonlyMap<string, Material>, id: string): string {
  let byMap = paths.get(byId);
  if (byMap === undefined) {
    byMap = new Map();
    let index = 0;
    for (const key of byId.keys()) byMap.set(key, `materials.${index++}`);
    paths.set(byId, byMap);
  }
  return byMap.get(id) ?? "materials";
}
