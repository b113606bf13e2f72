import type { Material } from "./material-schema";
import type { AlcoholRelease, Notice } from "./result-types";

/** Closing words of every safety notice. */
const SDS = "Check the supplier's safety data sheet and follow local regulations.";

/** GHS hazard statements (UN GHS): fatal or toxic if inhaled. */
const INHALATION_TOXIC = ["H330", "H331"];
/** GHS hazard statement (UN GHS): causes severe skin burns and eye damage. */
const CORROSIVE = ["H314"];
/** GHS hazard statement (UN GHS): causes serious eye damage. */
const SEVERE_EYE_DAMAGE = ["H318"];

function hasHazard(material: Material, codes: readonly string[]): boolean {
  const hazards = material.hazards;
  if (hazards === undefined) return false;
  for (const code of hazards) {
    for (const wanted of codes) if (code.startsWith(wanted)) return true;
  }
  return false;
}

function names(materials: readonly Material[]): string {
  let text = "";
  for (let i = 0; i < materials.length; i += 1) text = i === 0 ? materials[i]!.name : `${text}, ${materials[i]!.name}`;
  return text;
}

/** The materials that carry one of the hazard statements `codes` (by prefix), in order. */
function withHazard(materials: readonly Material[], codes: readonly string[]): Material[] {
  const found: Material[] = [];
  for (const material of materials) if (hasHazard(material, codes)) found.push(material);
  return found;
}

/** Release of methanol: the alcohol's name, trimmed, in lower case. */
const isMethanol = (name: string): boolean => name.trim().toLowerCase() === "methanol";

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
  const alkoxides: Material[] = [];
  for (const material of dispensed) {
    if (material.moistureSensitive ?? (material.kind === "precursor" && (material.precursor?.hydrolysableGroupsPerMolecule ?? 0) > 0)) {
      alkoxides.push(material);
    }
  }
  if (alkoxides.length > 0) {
    notices.push({
      level: "caution",
      code: "alkoxide_handling",
      message: `Alkoxides (${names(alkoxides)}) are moisture-sensitive and flammable: keep containers closed, dispense dry, away from ignition sources. ${SDS}`,
    });
  }
  let methanol = false;
  for (const alcohol of alcohols) {
    if (isMethanol(alcohol.name) && alcohol.mol > 0) {
      methanol = true;
      break;
    }
  }
  if (methanol) {
    const sources: Material[] = [];
    for (const material of dispensed) {
      const leaving = material.precursor?.leavingAlcohol;
      if (leaving && isMethanol(leaving.name)) sources.push(material);
    }
    notices.push({
      level: "caution",
      code: "methanol_released",
      message: `Hydrolysis of methoxy precursors (${names(sources)}) releases methanol, toxic by inhalation, skin contact and ingestion: work in a fume hood. ${SDS}`,
    });
  }
  const toxic = withHazard(dispensed, INHALATION_TOXIC);
  if (toxic.length > 0) {
    const eyes = withHazard(toxic, SEVERE_EYE_DAMAGE);
    notices.push({
      level: "caution",
      code: "toxic_by_inhalation",
      message:
        `${names(toxic)}: acutely toxic by inhalation` +
        (eyes.length > 0 ? `; ${names(eyes)} also cause${eyes.length === 1 ? "s" : ""} severe eye damage` : "") +
        `. Handle only in a fume hood with eye protection. ${SDS}`,
    });
  }
  const corrosive = withHazard(dispensed, CORROSIVE);
  if (corrosive.length > 0) {
    notices.push({
      level: "caution",
      code: "corrosive",
      message: `${names(corrosive)}: corrosive, causes severe skin burns and eye damage; wear gloves and eye protection. ${SDS}`,
    });
  }
  return notices;
}
