/**
 * The parts of a formulation file added with modifiers and stages: the
 * optional Modifiers sheet, and the optional Stage and Atmosphere columns of
 * the Process steps sheet. Files written before these existed have neither and
 * import as before (no modifiers; every step a cure in air).
 */
import { headerKey, headerStem, isBlankRow, readNumber, readText, SheetProblems } from "./cells";
import type { Location } from "./import-formulation";
import { MODIFIER_COLUMNS } from "./template";
import type { Cell, ImportProblem, SheetGrid } from "./types";

/** The index of an optional column in a sheet's header row (matched with or without its bracketed words). */
export function optionalColumn(sheet: SheetGrid, header: string): number | undefined {
  const index = (sheet.rows[0] ?? []).findIndex((cell) => {
    const text = readText(cell);
    return text !== undefined && (headerKey(text) === headerKey(header) || headerStem(text) === headerStem(header));
  });
  return index < 0 ? undefined : index;
}

/**
 * One of a few words (stage, atmosphere) from a step's cell; blank → undefined.
 * Anything else is an error on that cell.
 */
export function readStepWord<T extends string>(
  row: readonly Cell[],
  col: number | undefined,
  header: string,
  words: readonly T[],
  what: string,
  fallback: T,
  p: SheetProblems,
  r: number,
): T | undefined {
  if (col === undefined) return undefined;
  const text = readText(row[col]);
  if (text === undefined) return undefined;
  const word = words.find((w) => w === text.toLowerCase());
  if (!word) p.error(r, { index: col, header }, `${what} must be one of ${words.join(", ")} (not “${text}”); leave it blank for ${fallback}.`);
  return word;
}

/** A modifier row as read, before the schema checks it. */
export interface ModifierDraft {
  materialId: string;
  precursorId: string;
  molPerMetal: number | undefined;
}

/**
 * Reads the Modifiers sheet: modifier, precursor modified, mol per mol metal.
 * `resolve` turns a material name into its id (reporting unknown names at the cell).
 */
export function readModifiersSheet(
  sheet: SheetGrid | undefined,
  problems: ImportProblem[],
  resolve: (name: string, at: Location) => string,
  locate: (path: string, at: Location) => void,
): ModifierDraft[] {
  if (!sheet) return [];
  const p = new SheetProblems(problems, sheet);
  const cols = MODIFIER_COLUMNS.map((header) => optionalColumn(sheet, header));
  const out: ModifierDraft[] = [];
  const dataRows = sheet.rows.map((_, r) => r).filter((r) => r > 0 && !isBlankRow(sheet.rows[r]));
  if (dataRows.length === 0) return [];
  if (cols.some((c) => c === undefined)) {
    p.error(0, null, `Row ${p.rowNumber(0)} must be the header row with the columns ${MODIFIER_COLUMNS.map((h) => `“${h}”`).join(", ")}.`);
    return [];
  }
  const [modifierCol, precursorCol, ratioCol] = cols as number[];
  for (const r of dataRows) {
    const row = sheet.rows[r]!;
    const i = out.length;
    const at = (index: number, header: string): Location => ({ sheet, rowIndex: r, col: { index, header } });
    const modifierAt = at(modifierCol!, MODIFIER_COLUMNS[0]);
    const precursorAt = at(precursorCol!, MODIFIER_COLUMNS[1]);
    const ratioAt = at(ratioCol!, MODIFIER_COLUMNS[2]);
    locate(`modifiers.${i}`, modifierAt);
    locate(`modifiers.${i}.materialId`, modifierAt);
    locate(`modifiers.${i}.precursorId`, precursorAt);
    locate(`modifiers.${i}.molPerMetal`, ratioAt);
    const modifierName = readText(row[modifierCol!]);
    const precursorName = readText(row[precursorCol!]);
    if (!modifierName) p.error(r, modifierAt.col, "Each modifier row needs the modifier's material name.");
    if (!precursorName) p.error(r, precursorAt.col, "Each modifier row needs the name of the precursor it modifies.");
    const { value, error } = readNumber(row[ratioCol!], "mol per mol metal");
    if (error) p.error(r, ratioAt.col, `Modifier ratio: ${error}.`);
    else if (value === undefined) p.error(r, ratioAt.col, `“${modifierName ?? "This modifier"}” needs its ratio in mol per mol metal.`);
    out.push({
      materialId: modifierName ? resolve(modifierName, modifierAt) : "",
      precursorId: precursorName ? resolve(precursorName, precursorAt) : "",
      molPerMetal: value,
    });
  }
  return out;
}
