import type { CompositeFigures, PhaseInput } from "./composite";
import type { DecLine } from "./composition";
import { batchCost } from "./cost";
import { cureBalance } from "./cure";
import { Dec } from "./decimal";
import { filmPrediction } from "./film";
import type { FormulationInput } from "./input-schema";
import type { IndexedMaterial } from "./material-index";
import { coatOptics } from "./optics";
import type { FormulationResult } from "./result-types";
import { vocFigures } from "./voc";

/** The figures of the computation the coat predictions start from (decimal; units in the names). */
export interface CoatContext {
  input: FormulationInput;
  byId: Map<string, IndexedMaterial>;
  lines: readonly DecLine[];
  /** ρ_th, S / ρ_th and P of the dry composite, decimal (from `compositeFigures`). */
  composite: Pick<CompositeFigures, "theoreticalDensity" | "solidVolumeMl" | "solidVolumeFraction" | "porosity">;
  /** Phases of the dry composite, bonded ligands included. */
  phases: readonly PhaseInput[];
  /** S, g of dry composite. */
  solidMass: Dec;
  /** g of sol. */
  solMass: Dec;
  /** mL of sol (ideal mixing). */
  solVolume: Dec;
  /** 1 / mL of sol. */
  perMl: Dec;
  /** 1000 / mL of sol, i.e. 1 / (sol volume in L). */
  perLitre: Dec;
  /** Water in the sol, added and carried, mol. */
  totalWaterMol: Dec;
  waterEntry: IndexedMaterial;
  /** Alcohol released on full hydrolysis: mol, g/mol and g of each. */
  alcohols: Iterable<{ mol: Dec; molarMass: number; grams: Dec }>;
}

/**
 * Adds what the coat will be to a result (chemistry: "What the coat will
 * be"): the film (only when the input states a coating method), the dry
 * coat's refractive index beside the substrate's, VOC (always), the
 * epoxy–amine balance (when an equivalent weight is present) and the cost
 * (when the lines have prices), with their notices. Takes the composite's
 * theoretical density, dense volume and porosity (P = 0 when no bulk
 * density is known) as the decimals `compositeFigures` computed.
 *
 * @param result - the result so far; gains coating, optics, voc, cure, cost and notices
 * @param context - the decimal figures of the computation
 * @example
 * ```ts
 * addCoatPredictions(result, { input, byId, lines, composite, phases, solidMass, solMass, solVolume, perMl, perLitre, totalWaterMol, waterEntry, alcohols });
 * result.voc?.gramsPerLitre;
 * ```
 */
export function addCoatPredictions(result: FormulationResult, context: CoatContext): void {
  const { input, byId, lines, solidMass, solVolume } = context;
  const notices = result.notices;
  const { porosity, theoreticalDensity } = context.composite;

  let coverage: Dec | undefined;
  if (input.coating) {
    // φ_s = (S / ρ_th) / V_sol; ρ of the sol = sol mass / sol volume
    const film = filmPrediction(input.coating, {
      solidVolumeFraction: context.composite.solidVolumeFraction,
      porosity,
      densityGPerCm3: context.solMass.times(context.perMl),
    });
    result.coating = film.coating;
    coverage = new Dec(film.coating.coverageM2PerL);
    notices.push(...film.notices);
  }

  const substrate = input.substrateId === undefined ? undefined : byId.get(input.substrateId);
  const optics = coatOptics(context.phases, byId, porosity, theoreticalDensity, substrate, input.coating !== undefined);
  if (optics.optics) result.optics = optics.optics;
  notices.push(...optics.notices);

  const voc = vocFigures({ lines, byId, alcohols: context.alcohols, waterMol: context.totalWaterMol, waterEntry: context.waterEntry, solVolumeMl: solVolume, perLitre: context.perLitre });
  result.voc = voc.voc;
  notices.push(...voc.notices);

  const cure = cureBalance(lines, byId);
  if (cure.cure) result.cure = cure.cure;
  notices.push(...cure.notices);

  const cost = batchCost(lines, byId, solidMass, context.perLitre, coverage);
  if (cost.cost) result.cost = cost.cost;
  notices.push(...cost.notices);
}
