/**
 * A small RFC 4180 CSV reader of our own (quotes, doubled quotes, CRLF or
 * LF line ends, a comma or semicolon separator). CSV uploads never reach the
 * `xlsx` package, whose CSV and text parsers have published advisories.
 * Runs in linear time; rows and cell lengths are capped.
 */
import { IMPORT_LIMITS, type ImportLimits } from "./template";
import type { Cell, SheetGrid } from "./types";

/** Thrown when a CSV file breaks a limit or is not text; the message is for the user. */
export class CsvError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CsvError";
  }
}

function detectSeparator(text: string): "," | ";" {
  const firstLine = text.slice(0, Math.min(text.length, 4096)).split(/\r?\n/, 1)[0] ?? "";
  let commas = 0;
  let semicolons = 0;
  let quoted = false;
  for (const ch of firstLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && ch === ",") commas++;
    else if (!quoted && ch === ";") semicolons++;
  }
  return semicolons > commas ? ";" : ",";
}

/**
 * Parses CSV text into rows of strings (empty cells are null). Lines are
 * numbered from 1 in the returned `lines` array (the line each row starts on).
 *
 * @example
 * ```ts
 * parseCsv('a,"b ""c"""\r\n1,2').rows; // [["a", 'b "c"'], ["1", "2"]]
 * ```
 */
export function parseCsv(text: string, limits: ImportLimits = IMPORT_LIMITS): { rows: Cell[][]; lines: number[] } {
  if (text.includes("\u0000")) throw new CsvError("This file is not a text (CSV) file: it contains binary data.");
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const sep = detectSeparator(body);
  const rows: Cell[][] = [];
  const lines: number[] = [];
  let row: Cell[] = [];
  let field = "";
  let quoted = false;
  let wasQuoted = false;
  let line = 1;
  let rowLine = 1;
  const pushField = () => {
    if (field.length > limits.maxCellChars) {
      throw new CsvError(`Line ${rowLine}, column ${row.length + 1}: a cell holds more than ${limits.maxCellChars} characters.`);
    }
    row.push(field === "" && !wasQuoted ? null : field);
    if (row.length > limits.maxColumns) throw new CsvError(`Line ${rowLine}: more than ${limits.maxColumns} columns.`);
    field = "";
    wasQuoted = false;
  };
  const pushRow = () => {
    pushField();
    rows.push(row);
    lines.push(rowLine);
    if (rows.length > limits.maxRows) {
      throw new CsvError(`The file has more than ${limits.maxRows.toLocaleString("en")} rows; split it into smaller files.`);
    }
    row = [];
  };
  for (let i = 0; i < body.length; i++) {
    const ch = body[i]!;
    if (quoted) {
      if (ch === '"') {
        if (body[i + 1] === '"') {
          field += '"';
          i++;
        } else quoted = false;
      } else {
        if (ch === "\n") line++;
        field += ch;
        if (field.length > limits.maxCellChars) {
          throw new CsvError(`Line ${rowLine}: a quoted cell holds more than ${limits.maxCellChars} characters (is a closing quote missing?).`);
        }
      }
      continue;
    }
    if (ch === '"' && field === "") {
      quoted = true;
      wasQuoted = true;
    } else if (ch === sep) pushField();
    else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && body[i + 1] === "\n") i++;
      pushRow();
      line++;
      rowLine = line;
    } else field += ch;
  }
  if (quoted) throw new CsvError(`Line ${rowLine}: a quoted cell is never closed.`);
  if (field !== "" || row.length > 0 || wasQuoted) pushRow();
  return { rows, lines };
}

/**
 * Splits parsed CSV rows into sheets: rows before the first "[Sheet name]"
 * line belong to `defaultSheet`; each "[Name]" line starts a sheet of that name.
 * Each sheet keeps the file line numbers of its rows for problem reports.
 */
export function csvToSheets(text: string, defaultSheet: string, limits: ImportLimits = IMPORT_LIMITS): (SheetGrid & { lineOf: number[] })[] {
  const { rows, lines } = parseCsv(text, limits);
  const sheets: (SheetGrid & { lineOf: number[] })[] = [];
  let current: SheetGrid & { lineOf: number[] } = { name: defaultSheet, rows: [], lineOf: [] };
  rows.forEach((row, index) => {
    const first = row[0];
    const rest = row.slice(1).every((cell) => cell === null);
    const marker = typeof first === "string" && rest ? /^\[(.{1,31})\]$/.exec(first.trim()) : null;
    if (marker) {
      if (current.rows.length > 0) sheets.push(current);
      current = { name: marker[1]!.trim(), rows: [], lineOf: [] };
      return;
    }
    current.rows.push(row);
    current.lineOf.push(lines[index]!);
  });
  if (current.rows.length > 0 || sheets.length === 0) sheets.push(current);
  if (sheets.length > limits.maxSheets) throw new CsvError(`The file has more than ${limits.maxSheets} tables.`);
  // Blank lines between tables are not part of either table.
  for (const sheet of sheets) {
    while (sheet.rows.length > 0 && sheet.rows[sheet.rows.length - 1]!.every((c) => c === null)) {
      sheet.rows.pop();
      sheet.lineOf.pop();
    }
  }
  return sheets;
}
