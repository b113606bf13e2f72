import type { PhaseInput } from "./composite";
import { FRINGE_INDEX_MISMATCH } from "./constants";
import { add, type Dec, dec, ONE, squareRoot, toNumber, ZERO } from "./decimal";
import type { IndexedMaterial } from "./material-index";
import type { Material } from "./material-schema";
import type { Notice, OpticsResult } from "./result-types";

/** Largest number of cached Lorentz–Lorenz terms kept before the cache is emptied. */
const TERM_CACHE_LIMIT = 1000;
const termCache = new Map<number, Dec>();

/**
 * The Lorentz–Lorenz term of a refractive index, (n² − 1) / (n² + 2),
 * dimensionless; memoised (material indices recur on every call).
 *
 * @example
 * ```ts
 * lorentzLorenzTerm(1.5).toNumber(); // 1.25 / 4.25 = 0.2941…
 * ```
 */
export function lorentzLorenzTerm(n: number): Dec {
  let term = termCache.get(n);
  if (term === undefined) {
    if (termCache.size >= TERM_CACHE_LIMIT) termCache.clear();
    const square = dec(n).times(dec(n));
    term = square.minus(1).div(square.plus(2));
    termCache.set(n, term);
  }
  return term;
}

/**
 * The refractive index whose Lorentz–Lorenz term is L: n = √((1 + 2L) / (1 − L)).
 *
 * @example
 * ```ts
 * indexFromTerm(lorentzLorenzTerm(1.5)).toNumber(); // 1.5
 * ```
 */
export function indexFromTerm(term: Dec): Dec {
  return squareRoot(ONE.plus(term.times(2)).div(ONE.minus(term)));
}

/** L(n) / ρ by index, then by density (numbers as keys: no key text to build per phase and call). */
const perDensityCache = new Map<number, Map<number, Dec>>();
let perDensityCount = 0;

/**
 * L(n) / ρ for a phase of index n and density ρ (cm³/g), memoised: with it the
 * volume-weighted sum Σ φ_k L_k = ρ_th · Σ w_k · L(n_k) / ρ_k takes one
 * multiplication per phase (the phases' constants recur on every call).
 */
function termPerDensity(index: number, density: Dec, densityValue: number): Dec {
  let byDensity = perDensityCache.get(index);
  let value = byDensity?.get(densityValue);
  if (value === undefined) {
    if (perDensityCount >= TERM_CACHE_LIMIT) {
      perDensityCache.clear();
      perDensityCount = 0;
      byDensity = undefined;
    }
    if (byDensity === undefined) {
      byDensity = new Map();
      perDensityCache.set(index, byDensity);
    }
    value = lorentzLorenzTerm(index).div(density);
    byDensity.set(densityValue, value);
    perDensityCount += 1;
  }
  return value;
}

/**
 * Refractive index of a mixture by Lorentz–Lorenz mixing over volume
 * fractions, porosity counted as air (n = 1, term 0) (Born & Wolf,
 * Principles of Optics): (n² − 1)/(n² + 2) = (1 − P) · Σ φ_k (n_k² − 1)/(n_k² + 2).
 *
 * @param parts - volume fractions φ_k of the dense solid (summing to 1) and their indices n_k
 * @param porosity - P, volume fraction of pores
 * @returns n of the mixture
 * @example
 * ```ts
 * mixtureIndex([{ volumeFraction: dec(1), index: 1.46 }], dec(0.5)).toNumber(); // ≈ 1.2196
 * ```
 */
export function mixtureIndex(parts: readonly { volumeFraction: Dec; index: number }[], porosity: Dec): Dec {
  let term = ZERO;
  for (const part of parts) term = term.plus(part.volumeFraction.times(lorentzLorenzTerm(part.index)));
  return indexFromTerm(porosity.isZero() ? term : term.times(ONE.minus(porosity)));
}

/**
 * n_D of the phase a material leaves in the dry coat: a precursor's residue
 * (precursor.residueRefractiveIndex), or an organic phase's or a modifier's
 * bonded ligand's own refractiveIndex.
 *
 * @example
 * ```ts
 * phaseIndex(teos); // 1.4585 (amorphous silica)
 * ```
 */
export function phaseIndex(material: Material): number | undefined {
  return material.kind === "precursor" ? material.precursor?.residueRefractiveIndex : material.refractiveIndex;
}

function phaseName(material: Material, phase: PhaseInput): string {
  if (material.kind === "precursor") return `the ${phase.residueFormula ?? "residue"} of ${material.name}`;
  if (material.kind === "modifier") return `the bonded ligand of ${material.name}`;
  return material.name;
}

function indexPath(entry: IndexedMaterial): string {
  return entry.material.kind === "precursor" ? `${entry.path}.precursor.residueRefractiveIndex` : `${entry.path}.refractiveIndex`;
}

/**
 * The dry coat's refractive index (Lorentz–Lorenz over the phases of the
 * dry composite, bonded ligands included, porosity as air) beside the
 * substrate's. A substrate with a refractive index is taken to be
 * transparent: with |Δn| > 0.01 it gets the fringe caution (common
 * practice, from memory); opaque substrates (metals, filled or
 * semicrystalline plastics) carry no index. When a phase lacks an index
 * there is no result, and a notice names the phases without one — unless
 * no phase has one and nothing asks for the coat's index (no coating, no
 * substrate index), where the formulation is not a coat and nothing is said.
 *
 * @param phases - phases of the dry composite, with weight fractions and dry densities
 * @param byId - the indexed materials
 * @param porosity - P (0 when no bulk density is known)
 * @param theoreticalDensity - ρ_th of the dense dry composite, g/cm³ (1 / Σ w_k / ρ_k)
 * @param substrate - the substrate, when one is set
 * @param coatingSet - whether the input states a coating method
 * @returns the optics figures (or none) and notices
 * @example
 * ```ts
 * coatOptics(phases, byId, ZERO, dec(1.6), byId.get("polycarbonate"), true).optics?.mismatch;
 * ```
 */
export function coatOptics(
  phases: readonly PhaseInput[],
  byId: Map<string, IndexedMaterial>,
  porosity: Dec,
  theoreticalDensity: Dec,
  substrate: IndexedMaterial | undefined,
  coatingSet: boolean,
): { optics?: OpticsResult; notices: Notice[] } {
  const substrateIndex = substrate?.material.refractiveIndex;
  let weightedTerm = ZERO;
  let known = 0;
  const missing: { name: string; path: string }[] = [];
  for (const phase of phases) {
    if (phase.weightFraction.isZero()) continue;
    const entry = byId.get(phase.materialId);
    if (!entry) continue;
    const index = phaseIndex(entry.material);
    if (index === undefined) {
      missing.push({ name: phaseName(entry.material, phase), path: indexPath(entry) });
      continue;
    }
    // add: a Wide fraction's terms add up exactly (see decimal.ts)
    weightedTerm = add(weightedTerm, phase.weightFraction.times(termPerDensity(index, phase.density, phase.densityValue)));
    known += 1;
  }
  if (missing.length > 0) {
    if (known === 0 && !coatingSet && substrateIndex === undefined) return { notices: [] };
    return {
      notices: [
        {
          level: "info",
          code: "coat_index_unknown",
          field: missing[0]?.path,
          message:
            `The coat's refractive index is not given because ${missing.map((m) => m.name).join(", ")} ` +
            `${missing.length === 1 ? "has" : "have"} no refractive index; add it to the material to see the coat's index beside the substrate's.`,
        },
      ],
    };
  }
  if (known === 0) return { notices: [] };
  // Σ φ_k L_k = ρ_th · Σ w_k L_k / ρ_k, since φ_k = (w_k/ρ_k) · ρ_th
  const term = weightedTerm.times(theoreticalDensity);
  const n = indexFromTerm(porosity.isZero() ? term : term.times(ONE.minus(porosity)));
  const optics: OpticsResult = { refractiveIndex: toNumber(n) };
  const notices: Notice[] = [];
  if (substrateIndex !== undefined && substrate) {
    const mismatch = toNumber(n.minus(dec(substrateIndex)));
    optics.substrateIndex = substrateIndex;
    optics.mismatch = mismatch;
    if (Math.abs(mismatch) > FRINGE_INDEX_MISMATCH) {
      notices.push({
        level: "caution",
        code: "index_mismatch_fringes",
        field: "substrateId",
        message:
          `The coat's refractive index ${optics.refractiveIndex.toFixed(3)} differs from ${substrate.material.name}'s ${substrateIndex} by ` +
          `${mismatch > 0 ? "+" : ""}${mismatch.toFixed(3)}: beyond about ±${FRINGE_INDEX_MISMATCH} a coat on a transparent substrate shows interference fringes. ` +
          `${mismatch < 0 ? "A higher-index phase (titania, zirconia)" : "A lower-index phase (silica, an organosilane)"} would bring it closer.`,
      });
    }
  }
  return { optics, notices };
}
