/** Reading single cells of an uploaded sheet into text and numbers, with plain messages. */
import { restoreText } from "./neutralise";
import { NO_WORDS, YES_WORDS } from "./template";
import { columnLetter, type Cell, type ImportProblem, type SheetGrid } from "./types";

const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const NUMBER_WITH_UNIT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*([^\d\s.,].*)$/;
const DECIMAL_COMMA = /^[-+]?\d+,\d+$/;

/** Text of a cell: trimmed, neutralising undone; empty → undefined. */
export function readText(cell: Cell | undefined): string | undefined {
  if (cell === null || cell === undefined) return undefined;
  const text = restoreText(typeof cell === "string" ? cell.trim() : String(cell));
  return text === "" ? undefined : text;
}

/**
 * A number from a cell: numeric cells as they are, text that is a plain
 * number converted; blank → undefined. Text with a unit, a decimal comma or
 * anything else gives a message that says how to write it.
 *
 * @example
 * ```ts
 * readNumber("0.933", "g/cm³"); // { value: 0.933 }
 * readNumber("0.933 g/cm3", "g/cm³").error; // "“0.933 g/cm3” has a unit in it: …"
 * ```
 */
export function readNumber(cell: Cell | undefined, unit?: string): { value?: number; error?: string } {
  if (cell === null || cell === undefined) return {};
  if (typeof cell === "number") return Number.isFinite(cell) ? { value: cell } : { error: "is not a finite number" };
  if (typeof cell === "boolean") return { error: `“${String(cell).toUpperCase()}” is not a number` };
  const text = restoreText(cell.trim());
  if (text === "") return {};
  if (NUMBER.test(text)) return { value: Number(text) };
  if (DECIMAL_COMMA.test(text)) return { error: `“${text}” uses a decimal comma: write ${text.replace(",", ".")} with a point` };
  const withUnit = NUMBER_WITH_UNIT.exec(text);
  if (withUnit) {
    const [, number, suffix] = withUnit;
    if (suffix!.trim() === "%") {
      return { error: `“${text}” is a percentage: write fractions as numbers between 0 and 1 (${text} → ${Number(number) / 100})` };
    }
    const where = unit ? ` (${unit})` : "";
    return { error: `“${text}” has a unit in it: write the number alone (${number}); the unit is in the column header${where}` };
  }
  return { error: `“${text.length > 40 ? `${text.slice(0, 40)}…` : text}” is not a number` };
}

/**
 * A yes / no cell: yes, y, true, 1, x → true; no, n, false, 0 → false;
 * blank → undefined (not set).
 *
 * @example
 * ```ts
 * readFlag("Yes"); // { value: true }
 * readFlag("maybe").error; // "“maybe” is not yes or no"
 * ```
 */
export function readFlag(cell: Cell | undefined): { value?: boolean; error?: string } {
  if (cell === null || cell === undefined) return {};
  if (typeof cell === "boolean") return { value: cell };
  const text = restoreText(String(cell).trim()).toLowerCase();
  if (text === "") return {};
  if ((YES_WORDS as readonly string[]).includes(text)) return { value: true };
  if ((NO_WORDS as readonly string[]).includes(text)) return { value: false };
  return { error: `“${String(cell).trim()}” is not yes or no (leave it blank when not known)` };
}

/** Collects problems for one sheet, turning row indexes into spreadsheet rows or CSV lines. */
export class SheetProblems {
  constructor(
    private readonly out: ImportProblem[],
    readonly sheet: SheetGrid,
  ) {}

  /** The spreadsheet row (or CSV line) of a 0-based row index. */
  rowNumber(index: number): number {
    return this.sheet.lineOf?.[index] ?? index + 1;
  }

  add(level: ImportProblem["level"], rowIndex: number | null, col: { index: number; header: string } | null, message: string): void {
    this.out.push({
      level,
      sheet: this.sheet.name,
      row: rowIndex === null ? null : this.rowNumber(rowIndex),
      column: col ? col.header : null,
      columnLetter: col ? columnLetter(col.index) : null,
      message,
    });
  }

  error(rowIndex: number | null, col: { index: number; header: string } | null, message: string): void {
    this.add("error", rowIndex, col, message);
  }

  warning(rowIndex: number | null, col: { index: number; header: string } | null, message: string): void {
    this.add("warning", rowIndex, col, message);
  }
}

/** Normalises a header for matching: lower case, single spaces, unit in brackets optional. */
export function headerKey(text: string): string {
  return text.toLowerCase().replace(/\s+/g, " ").trim();
}

/** A header without its bracketed unit, for lenient matching. */
export function headerStem(text: string): string {
  return headerKey(text.replace(/\([^)]*\)/g, ""));
}

/** True when every cell of a row is blank. */
export function isBlankRow(row: readonly Cell[] | undefined): boolean {
  return !row || row.every((cell) => cell === null || (typeof cell === "string" && cell.trim() === ""));
}
