/** Shared types of the spreadsheet export and import. */

/** One cell as read from or written to a sheet. */
export type Cell = string | number | boolean | null;

/** A sheet as a grid that starts at A1: rows[0] is spreadsheet row 1. */
export interface SheetGrid {
  name: string;
  rows: Cell[][];
  /** For CSV files: the file line number of each row (tables after the first start further down). */
  lineOf?: number[];
}

/** Everything read from an uploaded file, before any meaning is given to it. */
export interface ParsedFile {
  format: "xlsx" | "csv";
  /** Every sheet name in the file (also the ones not read). */
  sheetNames: string[];
  /** The sheets that were read. */
  sheets: SheetGrid[];
}

/** One problem found in an uploaded file, located as a person would look for it. */
export interface ImportProblem {
  level: "error" | "warning";
  sheet: string;
  /** Spreadsheet row (1-based), or the CSV line; null when the problem concerns the whole sheet. */
  row: number | null;
  /** The column's header text, e.g. "Density as supplied (g/cm³)"; null when it concerns a whole row or sheet. */
  column: string | null;
  /** Column letter, e.g. "F"; null with `column`. */
  columnLetter: string | null;
  message: string;
}

/** Which kind of file an import expects. */
export type ImportKind = "formulation" | "materials";

/**
 * Column letter of a 0-based index.
 *
 * @example
 * ```ts
 * columnLetter(0); // "A"
 * columnLetter(27); // "AB"
 * ```
 */
export function columnLetter(index: number): string {
  let n = index + 1;
  let out = "";
  while (n > 0) {
    const rem = (n - 1) % 26;
    out = String.fromCharCode(65 + rem) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}
