/**
 * The dry coat's refractive index beside the substrate's, in plain float64:
 * the numeric twin of optics.ts (coatOptics), figures only, no notices.
 */
import type { Material } from "../material-schema";
import type { NumericPhaseInput } from "./context";
import { coatMaterialData } from "./coat-material";

/** The optics figures, NaN where optics.ts leaves them out. */
export interface NumericOptics {
  /** n_D of the dry coat */
  refractiveIndex: number;
  /** coat − substrate; NaN without a substrate index */
  indexMismatch: number;
}

const ABSENT: NumericOptics = { refractiveIndex: Number.NaN, indexMismatch: Number.NaN };

/**
 * Lorentz–Lorenz mixing over the volume fractions of the dry composite's
 * phases (bonded ligands included), porosity as air (Born & Wolf,
 * Principles of Optics): (n² − 1)/(n² + 2) = (1 − P) · ρ_th · Σ w_k L(n_k) / ρ_k.
 * No index (NaN) when any phase with weight lacks one, or no phase has one,
 * as optics.ts gives no optics result then.
 *
 * @param phases - phases of the dry composite, weight fractions and dry densities
 * @param byId - the materials by id
 * @param porosity - P (0 when no bulk density is known)
 * @param theoreticalDensity - ρ_th, g/cm³
 * @param substrateId - the input's substrate, when set
 * @returns the coat's index and its mismatch to the substrate
 * @example
 * ```ts
 * numericOptics(ctx.phases, ctx.byId, 0, 2.2, "soda-lime-glass").refractiveIndex;
 * ```
 */
export function numericOptics(
  phases: readonly NumericPhaseInput[],
  byId: ReadonlyMap<string, Material>,
  porosity: number,
  theoreticalDensity: number,
  substrateId: string | undefined,
): NumericOptics {
  let weightedTerm = 0;
  let known = 0;
  for (const phase of phases) {
    if (phase.weightFraction === 0) continue;
    const material = byId.get(phase.materialId);
    if (!material) continue;
    const term = coatMaterialData(material).lorentzLorenzTerm;
    if (Number.isNaN(term)) return ABSENT;
    weightedTerm += phase.weightFraction * (term / phase.density);
    known += 1;
  }
  if (known === 0) return ABSENT;
  // Σ φ_k L_k = ρ_th · Σ w_k L_k / ρ_k, since φ_k = (w_k/ρ_k) · ρ_th
  const sum = weightedTerm * theoreticalDensity;
  const term = porosity === 0 ? sum : sum * (1 - porosity);
  const n = Math.sqrt((1 + term * 2) / (1 - term));
  const substrateIndex = substrateId === undefined ? undefined : byId.get(substrateId)?.refractiveIndex;
  return { refractiveIndex: n, indexMismatch: substrateIndex === undefined ? Number.NaN : n - substrateIndex };
}
