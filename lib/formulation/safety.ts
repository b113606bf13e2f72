import type { Material } from "./material-schema";
import type { AlcoholRelease, Notice } from "./result-types";

/** Closing words of every safety notice. */
const SDS = "Check the supplier's safety data sheet and follow local regulations.";

/** What a material's hazard statements say, as bits: acutely toxic by inhalation, severe eye damage, corrosive. */
const INHALATION_TOXIC = 1;
const SEVERE_EYE_DAMAGE = 2;
const CORROSIVE = 4;

/**
 * GHS hazard statements (UN GHS) by their code's prefix (a code such as
 * "H330" may carry letters after it): H330/H331 fatal or toxic if inhaled,
 * H318 causes serious eye damage, H314 causes severe skin burns and eye damage.
 */
const HAZARD_PREFIXES: readonly (readonly [string, number])[] = [
  ["H330", INHALATION_TOXIC],
  ["H331", INHALATION_TOXIC],
  ["H318", SEVERE_EYE_DAMAGE],
  ["H314", CORROSIVE],
];
const CODE_H = 0x48;
const CODE_3 = 0x33;

/** The bits of the hazards a material carries; every prefix above starts with "H3", so other codes are passed over. */
function hazardBits(material: Material): number {
  const hazards = material.hazards;
  if (hazards === undefined) return 0;
  let bits = 0;
  for (const code of hazards) {
    if (code.charCodeAt(0) !== CODE_H || code.charCodeAt(1) !== CODE_3) continue;
    for (const [prefix, bit] of HAZARD_PREFIXES) if (code.startsWith(prefix)) bits |= bit;
  }
  return bits;
}

function names(materials: readonly Material[]): string {
  let text = "";
  for (let i = 0; i < materials.length; i += 1) text = i === 0 ? materials[i]!.name : `${text}, ${materials[i]!.name}`;
  return text;
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
  // one pass over each material's hazard statements; the lists keep the order of `dispensed`
  const toxic: Material[] = [];
  const eyes: Material[] = [];
  const corrosive: Material[] = [];
  for (const material of dispensed) {
    const bits = hazardBits(material);
    if (bits & INHALATION_TOXIC) {
      toxic.push(material);
      if (bits & SEVERE_EYE_DAMAGE) eyes.push(material);
    }
    if (bits & CORROSIVE) corrosive.push(material);
  }
  if (toxic.length > 0) {
    notices.push({
      level: "caution",
      code: "toxic_by_inhalation",
      message:
        `${names(toxic)}: acutely toxic by inhalation` +
        (eyes.length > 0 ? `; ${names(eyes)} also cause${eyes.length === 1 ? "s" : ""} severe eye damage` : "") +
        `. Handle only in a fume hood with eye protection. ${SDS}`,
    });
  }
  if (corrosive.length > 0) {
    notices.push({
      level: "caution",
      code: "corrosive",
      message: `${names(corrosive)}: corrosive, causes severe skin burns and eye damage; wear gloves and eye protection. ${SDS}`,
    });
  }
  return notices;
}
