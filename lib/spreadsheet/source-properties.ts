/**
 * The Property column of the Material sources sheet: the words a person reads
 * for each property a source is given for, and back again on import. A
 * property with a column on the Materials sheet is named by that column's
 * header ("Density as supplied (g/cm³)"); a few without one have words of
 * their own; any other is written in words with its key in brackets, which
 * the import reads back ("Shelf life [storage.shelfLifeDays]").
 */
import { headerKey, headerStem } from "./cells";
import { MATERIAL_COLUMNS } from "./template";

/** Words for properties a source may be given for that have no column of their own. */
export const SOURCE_PROPERTY_WORDS: Readonly<Record<string, string>> = {
  "precursor.leavingAlcohol": "Leaving alcohol (name and molar mass)",
  precursor: "Precursor data (residue, network atoms, hydrolysable groups)",
  thermal: "Thermal data",
  sources: "Sources",
};

/** "precursor.residueMolarMass" → "precursor residue molar mass". */
function inWords(key: string): string {
  return key
    .split(".")
    .map((part) => part.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase())
    .join(" ");
}

/**
 * The words for a source's property key.
 *
 * @example sourcePropertyLabel("density") // "Density as supplied (g/cm³)"
 * @example sourcePropertyLabel("precursor.leavingAlcohol") // "Leaving alcohol (name and molar mass)"
 * @example sourcePropertyLabel("storage.shelfLifeDays") // "Storage shelf life days [storage.shelfLifeDays]"
 */
export function sourcePropertyLabel(key: string): string {
  const column = MATERIAL_COLUMNS.find((c) => c.path === key);
  if (column) return column.header;
  const words = SOURCE_PROPERTY_WORDS[key];
  if (words) return words;
  const text = inWords(key);
  return `${text.charAt(0).toUpperCase()}${text.slice(1)} [${key}]`;
}

/**
 * The property key for the words in a sources sheet's Property cell (a
 * Materials column header, with or without its unit; our own words; or a key
 * in brackets at the end); the text itself when none matches.
 *
 * @example sourcePropertyKey("Density as supplied") // "density"
 * @example sourcePropertyKey("Leaving alcohol (name and molar mass)") // "precursor.leavingAlcohol"
 */
export function sourcePropertyKey(text: string): string {
  const bracketed = /\[([^\]]+)\]\s*$/.exec(text);
  if (bracketed) return bracketed[1]!.trim();
  const named: [string, string][] = [...MATERIAL_COLUMNS.map((c): [string, string] => [c.header, c.path]), ...Object.entries(SOURCE_PROPERTY_WORDS).map(([key, words]): [string, string] => [words, key])];
  // The exact words first, then the words without their bracketed unit.
  for (const compare of [headerKey, headerStem]) {
    const hit = named.find(([words]) => compare(words) === compare(text));
    if (hit) return hit[1];
  }
  return text.trim();
}
