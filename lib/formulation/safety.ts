import type { Material } from "./material-schema";
import type { AlcoholRelease, Notice } from "./result-types";

/** Closing words of every safety notice. */
const SDS = "Check the supplier's safety data sheet and follow local regulations.";

/** GHS hazard statements (UN GHS): fatal or toxic if inhaled. */
const INHALATION_TOXIC = ["H330", "H331"];
/** GHS hazard statement (UN GHS): causes severe skin burns and eye damage. */
const CORROSIVE = "H314";
/** GHS hazard statement (UN GHS): causes serious eye damage. */
const SEVERE_EYE_DAMAGE = "H318";

function hasHazard(material: Material, codes: readonly string[]): boolean {
  return (material.hazards ?? []).some((code) => codes.some((wanted) => code.startsWith(wanted)));
}

function names(materials: readonly Material[]): string {
  return materials.map((material) => material.name).join(", ");
}

/**
 * Safety notices for the dispensed materials (chemistry: "Safety"): alkoxides
 * moisture-sensitive and flammable (the material flag `moistureSensitive`,
 * else any precursor with alkoxy groups); methanol released by methoxy precursors;
 * materials acutely toxic by inhalation (GHS H330/H331, e.g.
 * tetramethoxysilane, with H318 severe eye damage); corrosive stocks (H314,
 * strong acids, ammonia). Each defers to the supplier's safety data sheet.
 *
 * @param dispensed - materials in the batch, in order of addition
 * @param alcohols - alcohol released on full hydrolysis (mol)
 * @returns caution notices
 * @example
 * ```ts
 * safetyNotices([tmos], [{ name: "methanol", mol: 0.4, grams: 12.8 }]).map((n) => n.code);
 * // ["alkoxide_handling", "methanol_released", "toxic_by_inhalation"]
 * ```
 */
export function safetyNotices(dispensed: readonly Material[], alcohols: readonly AlcoholRelease[]): Notice[] {
  const notices: Notice[] = [];
  // The material's own flag decides; without one, a precursor with alkoxy groups is taken to be an alkoxide.
  const alkoxides = dispensed.filter(
    (material) => material.moistureSensitive ?? (material.kind === "precursor" && (material.precursor?.hydrolysableGroupsPerMolecule ?? 0) > 0),
  );
  if (alkoxides.length > 0) {
    notices.push({
      level: "caution",
      code: "alkoxide_handling",
      message: `Alkoxides (${names(alkoxides)}) are moisture-sensitive and flammable: keep containers closed, dispense dry, away from ignition sources. ${SDS}`,
    });
  }
  const methanol = alcohols.find((alcohol) => alcohol.name.trim().toLowerCase() === "methanol" && alcohol.mol > 0);
  if (methanol) {
    const sources = dispensed.filter(
      (material) => material.precursor?.leavingAlcohol?.name.trim().toLowerCase() === "methanol",
    );
    notices.push({
      level: "caution",
      code: "methanol_released",
      message: `Hydrolysis of methoxy precursors (${names(sources)}) releases methanol, toxic by inhalation, skin contact and ingestion: work in a fume hood. ${SDS}`,
    });
  }
  const toxic = dispensed.filter((material) => hasHazard(material, INHALATION_TOXIC));
  if (toxic.length > 0) {
    const eyes = toxic.filter((material) => hasHazard(material, [SEVERE_EYE_DAMAGE]));
    notices.push({
      level: "caution",
      code: "toxic_by_inhalation",
      message:
        `${names(toxic)}: acutely toxic by inhalation` +
        (eyes.length > 0 ? `; ${names(eyes)} also cause${eyes.length === 1 ? "s" : ""} severe eye damage` : "") +
        `. Handle only in a fume hood with eye protection. ${SDS}`,
    });
  }
  const corrosive = dispensed.filter((material) => hasHazard(material, [CORROSIVE]));
  if (corrosive.length > 0) {
    notices.push({
      level: "caution",
      code: "corrosive",
      message: `${names(corrosive)}: corrosive, causes severe skin burns and eye damage; wear gloves and eye protection. ${SDS}`,
    });
  }
  return notices;
}
