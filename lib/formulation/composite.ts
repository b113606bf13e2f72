import { add, cubeRoot, Dec, ONE, per, quotient, toNumber, ZERO } from "./decimal";
import { FormulationError } from "./errors";
import type { CompositePhase, CompositeResult, Shrinkage } from "./result-types";

/** A phase of the dry composite before volume fractions are known. */
export interface PhaseInput {
  materialId: string;
  residueFormula?: string;
  /** w_k, mass fraction. */
  weightFraction: Dec;
  /** w_k as given in the input. */
  weightFractionValue: number;
  /** ρ_k, g/cm³ of the dry phase. */
  density: Dec;
  /** ρ_k as given in the material data. */
  densityValue: number;
}

/** A known bulk density (g/cm³) and the input field it came from. */
export interface BulkDensity {
  density: Dec;
  field: string;
}

/** The composite figures, with the decimals the coat predictions go on from. */
export interface CompositeFigures {
  /** The figures as reported. */
  result: CompositeResult;
  /** ρ_th, g/cm³ (decimal). */
  theoreticalDensity: Dec;
  /** S / ρ_th, mL of dense dry composite (decimal). */
  solidVolumeMl: Dec;
  /** φ_s = (S / ρ_th) / V_sol, volume fraction of dense solid in the sol (decimal). */
  solidVolumeFraction: Dec;
  /** P, 0 when no bulk density is known (decimal). */
  porosity: Dec;
}

/**
 * Volumetric and linear shrinkage from a sol volume to a solid volume, from
 * their ratio r = V_solid / V_sol: volumetric = 1 − r, linear = 1 − r^(1/3).
 *
 * @example
 * ```ts
 * shrinkage(new Dec(0.27)); // { volumetric: 0.73, linear: 0.7 }
 * ```
 */
export function shrinkage(ratio: Dec): Shrinkage {
  return { volumetric: toNumber(ONE.minus(ratio)), linear: toNumber(ONE.minus(cubeRoot(ratio))) };
}

/**
 * The ideal dry composite (chemistry: "Sol and dry composite"):
 * φ_k = (w_k / ρ_k) / Σ (w_j / ρ_j); ρ_th = 1 / Σ (w_k / ρ_k);
 * porosity P = 1 − ρb / ρth when a bulk density is known; shrinkage from the
 * sol volume to the dense solid (S / ρth) and to the dry gel (S / ρb).
 * Throws "bulk_density_above_theoretical" when ρb > ρth.
 *
 * @param phases - residues and organic phases with weight fraction and dry density
 * @param solidMass - S, g
 * @param perMl - 1 / sol volume, 1/mL (ideal mixing)
 * @param bulk - bulk density of the dry gel, if known
 * @returns composite figures as plain numbers (`result`), and ρ_th, S / ρ_th, φ_s and P as decimals
 * @example
 * ```ts
 * // 100 % silica (2.20 g/cm³), S = 22 g, sol 100 mL → dense solid 10 mL, volumetric shrinkage 0.9
 * compositeFigures([{ materialId: "teos", weightFraction: new Dec(1), weightFractionValue: 1, density: new Dec(2.2), densityValue: 2.2 }],
 *   new Dec(22), new Dec(0.01)).result.denseShrinkage.volumetric; // 0.9
 * ```
 */
export function compositeFigures(
  phases: readonly PhaseInput[],
  solidMass: Dec,
  perMl: Dec,
  bulk?: BulkDensity,
): CompositeFigures {
  const specificVolumes = phases.map((phase) => per(phase.weightFraction, phase.densityValue));
  // add: a Wide fraction's w/ρ terms then add up exactly (see decimal.ts)
  let totalSpecificVolume = ZERO;
  for (const value of specificVolumes) totalSpecificVolume = add(totalSpecificVolume, value);
  const theoreticalDensity = ONE.div(totalSpecificVolume);
  const outPhases: CompositePhase[] = phases.map((phase, index) => {
    const out: CompositePhase = {
      materialId: phase.materialId,
      weightFraction: phase.weightFractionValue,
      // φ_k = (w_k/ρ_k) / Σ(w_j/ρ_j) = (w_k/ρ_k) · ρ_th
      volumeFraction: toNumber((specificVolumes[index] ?? ZERO).times(theoreticalDensity)),
      density: phase.densityValue,
    };
    if (phase.residueFormula !== undefined) out.residueFormula = phase.residueFormula;
    return out;
  });
  // S / ρ_th = S · Σ (w_k / ρ_k)
  const solidVolumeMl = solidMass.times(totalSpecificVolume);
  const solidVolumeFraction = solidVolumeMl.times(perMl);
  const result: CompositeResult = {
    massGrams: toNumber(solidMass),
    theoreticalDensity: toNumber(theoreticalDensity),
    phases: outPhases,
    denseShrinkage: shrinkage(solidVolumeFraction),
  };
  let porosity = ZERO;
  if (bulk) {
    if (bulk.density.greaterThan(theoreticalDensity)) {
      throw new FormulationError(
        "bulk_density_above_theoretical",
        bulk.field,
        `bulk density ${toNumber(bulk.density)} g/cm³ exceeds the theoretical density ${Number(theoreticalDensity.toPrecision(5))} g/cm³ of this composition`,
      );
    }
    porosity = ONE.minus(bulk.density.div(theoreticalDensity));
    result.porosity = toNumber(porosity);
    result.dryGelShrinkage = shrinkage(quotient(solidMass, bulk.density).times(perMl));
  }
  return { result, theoreticalDensity, solidVolumeMl, solidVolumeFraction, porosity };
}
