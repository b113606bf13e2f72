/**
 * Writing workbooks and CSV files. Every text cell is neutralised against
 * formula injection (see neutralise.ts); numbers stay numeric cells; header
 * rows are frozen and columns get widths that fit their headers.
 */
import * as XLSX from "xlsx";
import { decimalPlaces, roundToResolution } from "@/lib/batches/resolution";
import { neutraliseText } from "./neutralise";
import type { Cell } from "./types";

/**
 * A sheet to write: `header` rows are frozen at the top; `widths` in
 * characters; `steps` per column: the resolution a numeric column is shown
 * at (e.g. 0.01 for a balance reading to 0.01 g). A workbook keeps the exact
 * value with a number format that shows that rounding; CSV writes the value
 * rounded.
 */
export interface SheetSpec {
  name: string;
  header: Cell[][];
  rows: Cell[][];
  widths?: number[];
  steps?: (number | undefined)[];
  /** Per data row: the resolution its numeric cells are shown at (for Item / Value / Unit tables); a column's step wins. */
  rowSteps?: (number | undefined)[];
}

/** The step a cell is shown at: its column's, else its row's. */
function stepAt(spec: { steps?: (number | undefined)[]; rowSteps?: (number | undefined)[] }, row: number, col: number): number | undefined {
  return spec.steps?.[col] ?? spec.rowSteps?.[row];
}

/**
 * The number format that shows a value at `step`: "0.00" for 0.01.
 *
 * @example numberFormatFor(0.001) // "0.000"
 */
export function numberFormatFor(step: number): string {
  const places = decimalPlaces(step);
  return places === 0 ? "0" : `0.${"0".repeat(places)}`;
}

/** Gives the numeric cells of the columns with a step their number format (data rows only). */
function formatColumns(ws: XLSX.WorkSheet, spec: SheetSpec): void {
  if (!spec.steps && !spec.rowSteps) return;
  spec.rows.forEach((row, index) => {
    const r = spec.header.length + index;
    row.forEach((_, c) => {
      const step = stepAt(spec, index, c);
      const cell = ws[XLSX.utils.encode_cell({ r, c })] as XLSX.CellObject | undefined;
      if (step !== undefined && cell?.t === "n") cell.z = numberFormatFor(step);
    });
  });
}

function safeCell(value: Cell | undefined): Cell {
  if (typeof value === "string") return neutraliseText(value);
  if (typeof value === "number" && !Number.isFinite(value)) return null;
  return value ?? null;
}

/** Every cell of a table, neutralised. */
export function safeRows(rows: readonly (readonly (Cell | undefined)[])[]): Cell[][] {
  return rows.map((row) => row.map(safeCell));
}

function autoWidths(spec: SheetSpec): number[] {
  const widths: number[] = [];
  for (const row of [...spec.header, ...spec.rows.slice(0, 200)]) {
    row.forEach((cell, index) => {
      const length = cell === null || cell === undefined ? 0 : String(cell).length;
      widths[index] = Math.min(Math.max(widths[index] ?? 8, length + 2), 60);
    });
  }
  return widths;
}

/**
 * Builds an .xlsx file from sheet specs. Header rows are frozen (the
 * community build of `xlsx` cannot write panes, so the sheet XML gets a
 * frozen pane added after writing).
 *
 * @example
 * ```ts
 * const bytes = buildWorkbook([{ name: "Batch sheet", header: [["Material", "Target mass (g)"]], rows: [["TEOS", 34.67]] }]);
 * ```
 */
export function buildWorkbook(sheets: readonly SheetSpec[]): Buffer {
  const wb = XLSX.utils.book_new();
  for (const spec of sheets) {
    const ws = XLSX.utils.aoa_to_sheet(safeRows([...spec.header, ...spec.rows]));
    formatColumns(ws, spec);
    const widths = spec.widths ?? autoWidths(spec);
    ws["!cols"] = widths.map((wch) => ({ wch }));
    XLSX.utils.book_append_sheet(wb, ws, spec.name);
  }
  const plain = XLSX.write(wb, { type: "buffer", bookType: "xlsx", bookSST: true, compression: true }) as Buffer;
  return freezeHeaders(plain, sheets.map((s) => s.header.length));
}

/** Adds a frozen pane below the header rows of each sheet (sheetN.xml in workbook order). */
function freezeHeaders(file: Buffer, headerRows: number[]): Buffer {
  const CFB = XLSX.CFB;
  const zip = CFB.read(file, { type: "buffer" });
  headerRows.forEach((rows, index) => {
    if (rows < 1) return;
    const entry = CFB.find(zip, `/xl/worksheets/sheet${index + 1}.xml`);
    if (!entry?.content) return;
    const xml = Buffer.from(entry.content as Uint8Array).toString("utf8");
    const pane = `<sheetView workbookViewId="0"><pane ySplit="${rows}" topLeftCell="A${rows + 1}" activePane="bottomLeft" state="frozen"/><selection pane="bottomLeft" activeCell="A${rows + 1}" sqref="A${rows + 1}"/></sheetView>`;
    const next = xml.replace(/<sheetView workbookViewId="0"\s*\/>/, pane);
    const bytes = Buffer.from(next, "utf8");
    entry.content = bytes;
    entry.size = bytes.length;
  });
  return CFB.write(zip, { fileType: "zip", type: "buffer", compression: true }) as Buffer;
}

/**
 * One CSV field: every cell is wrapped in double quotes and its double quotes
 * are doubled (OWASP "CSV Injection"), so no separator, quote or line break
 * inside a cell can start another cell. Numbers are quoted too (spreadsheet
 * programs still read a quoted number as a number) and never prefixed; an
 * empty cell stays empty.
 */
function csvField(value: Cell): string {
  if (value === null) return "";
  const text = typeof value === "string" ? value : String(value);
  return `"${text.replace(/"/g, '""')}"`;
}

/**
 * A CSV file (RFC 4180, CRLF line ends, UTF-8 with a byte-order mark so
 * spreadsheet programs read the units' symbols right). Every text cell is
 * neutralised and every cell quoted; numbers are written in full precision
 * with a point, except in a column or row with a step (see SheetSpec), where they
 * are rounded to it.
 * Further tables follow after a blank line and a "[Sheet name]" line.
 *
 * @example
 * ```ts
 * toCsv([{ name: "Batch sheet", rows: [["Material", "Target mass (g)"], ["TEOS", 34.67]] }]);
 * ```
 */
export function toCsv(
  tables: readonly {
    name: string;
    rows: readonly (readonly (Cell | undefined)[])[];
    steps?: (number | undefined)[];
    /** Per row of `rows` (header rows included): see SheetSpec.rowSteps. */
    rowSteps?: (number | undefined)[];
  }[],
): string {
  const lines: string[] = [];
  tables.forEach((table, index) => {
    if (index > 0) lines.push("", csvField(`[${table.name}]`));
    safeRows(table.rows).forEach((row, r) => {
      const shown = row.map((cell, c) => {
        const step = stepAt(table, r, c);
        return typeof cell === "number" && step !== undefined ? roundToResolution(cell, step) : cell;
      });
      lines.push(shown.map(csvField).join(","));
    });
  });
  return `\uFEFF${lines.join("\r\n")}\r\n`;
}
