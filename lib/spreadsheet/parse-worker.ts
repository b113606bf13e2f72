/**
 * The spreadsheet worker thread: reads one uploaded .xlsx workbook with
 * `xlsx` and answers with plain rows (see worker.ts, which starts it with a
 * time and memory limit and terminates it afterwards). Never import this file
 * from the app's own thread: `xlsx` parses uploads only here.
 *
 * A spare worker (workerData.warm) loads `xlsx` and reads a small workbook of
 * our own making before it says it is ready, so the upload that takes it does
 * not wait for module loading and a cold compiler; it has never seen anyone's
 * file before that upload.
 */
import { parentPort, threadId, workerData } from "node:worker_threads";
import * as XLSX from "xlsx";
import { PARSE_WORKER } from "./parse-worker-role";
import type { Cell } from "./types";

/** The sheet limits the worker applies (the time limit is the parent's). */
export interface ParseLimits {
  maxRows: number;
  maxColumns: number;
  maxSheets: number;
  maxCellChars: number;
}

/** What the parent asks the worker to read. */
export interface ParseRequest {
  bytes: Uint8Array;
  wanted: string[];
  firstSheetFallback: boolean;
  limits: ParseLimits;
}

/** One sheet as read. */
export interface ParsedSheet {
  name: string;
  rows: Cell[][];
  truncatedRows: boolean;
  truncatedColumns: boolean;
}

/** The worker's answer. */
export type ParseReply =
  | { ok: true; sheetNames: string[]; sheets: ParsedSheet[]; threadId: number; warmed: boolean }
  | { ok: false; code: "password_protected" | "corrupt" | "too_many_sheets"; message: string };

/** What the worker is started with: a spare to warm up, or one request to read. */
export type ParseWorkerData = { role: typeof PARSE_WORKER } & ({ warm: true; limits: ParseLimits } | { warm: false; request: ParseRequest });

/** Plain values only: no formulas, styles, HTML, macros or properties. */
const BASE: XLSX.ParsingOptions = {
  type: "buffer",
  cellFormula: false,
  cellHTML: false,
  cellText: false,
  cellStyles: false,
  cellDates: false,
  cellNF: false,
  bookVBA: false,
  bookDeps: false,
  bookFiles: false,
  bookProps: false,
  WTF: false,
  password: "",
};

/** A cell's plain value: numbers, booleans and text (cut just past the limit), else null. */
function plainValue(cell: XLSX.CellObject | undefined, maxCellChars: number): Cell {
  if (!cell) return null;
  if ((cell.t === "n" && typeof cell.v === "number") || (cell.t === "b" && typeof cell.v === "boolean")) return cell.v;
  if ((cell.t === "s" || (cell.t as string) === "str") && typeof cell.v === "string") return cell.v.slice(0, maxCellChars + 1);
  return null;
}

function readSheet(ws: XLSX.WorkSheet | undefined, limits: ParseLimits): Omit<ParsedSheet, "name"> {
  const rows: Cell[][] = [];
  let truncatedRows = false;
  let truncatedColumns = false;
  const ref = ws?.["!ref"];
  if (ws && typeof ref === "string") {
    const range = XLSX.utils.decode_range(ref);
    const fullRef = ws["!fullref"];
    const full = typeof fullRef === "string" ? XLSX.utils.decode_range(fullRef) : range;
    if (full.e.r + 1 > limits.maxRows) truncatedRows = true;
    if (range.e.c + 1 > limits.maxColumns) truncatedColumns = true;
    const lastRow = Math.min(range.e.r, limits.maxRows - 1);
    const lastCol = Math.min(range.e.c, limits.maxColumns - 1);
    // A dense sheet is an array of rows of cells.
    const dense = ws as unknown as (XLSX.CellObject | undefined)[][];
    for (let r = 0; r <= lastRow; r++) {
      const cells = Array.isArray(dense[r]) ? dense[r]! : [];
      const row: Cell[] = [];
      for (let c = 0; c <= lastCol; c++) row.push(plainValue(cells[c], limits.maxCellChars));
      while (row.length > 0 && row[row.length - 1] === null) row.pop();
      rows.push(row);
    }
  }
  return { rows, truncatedRows, truncatedColumns };
}

/** Reads the wanted sheets of one workbook. */
export function readWorkbook(req: ParseRequest, warmed: boolean): ParseReply {
  const buffer = Buffer.from(req.bytes.buffer, req.bytes.byteOffset, req.bytes.byteLength);
  let names: string[];
  try {
    names = XLSX.read(buffer, { ...BASE, bookSheets: true }).SheetNames.map(String);
  } catch (err) {
    const text = String((err instanceof Error && err.message) || err);
    return { ok: false, code: /password/i.test(text) ? "password_protected" : "corrupt", message: text };
  }
  if (names.length > req.limits.maxSheets) return { ok: false, code: "too_many_sheets", message: String(names.length) };
  const lower = new Map(names.map((n) => [n.trim().toLowerCase(), n]));
  const selected: string[] = [];
  for (const w of req.wanted) {
    const hit = lower.get(w.toLowerCase());
    if (hit !== undefined && !selected.includes(hit)) selected.push(hit);
  }
  if (selected.length === 0 && req.firstSheetFallback && names.length > 0) selected.push(names[0]!);
  const wb = XLSX.read(buffer, { ...BASE, sheets: selected, sheetRows: req.limits.maxRows + 1, dense: true });
  const sheets = selected.map((name) => ({ name: String(name), ...readSheet(wb.Sheets[name], req.limits) }));
  return { ok: true, sheetNames: names, sheets, threadId, warmed };
}

function answer(req: ParseRequest, warmed: boolean): void {
  let reply: ParseReply;
  try {
    reply = readWorkbook(req, warmed);
  } catch (err) {
    reply = { ok: false, code: "corrupt", message: String((err instanceof Error && err.message) || err) };
  }
  parentPort?.postMessage(reply);
}

/** Warm-up on a workbook of our own: a few hundred rows of text and numbers. */
function warmUp(limits: ParseLimits): void {
  const aoa: (string | number)[][] = [["Name", "Kind", "Molar mass", "Density", "Note"]];
  for (let i = 0; i < 600; i++) aoa.push([`warm-up ${i}`, i % 2 ? "precursor" : "organic", 100 + i / 7, 0.9 + i / 1000, i % 3 ? "" : "x"]);
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(aoa), "Warm-up");
  const bytes = XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
  for (let i = 0; i < 3; i++) readWorkbook({ bytes, wanted: ["Warm-up"], firstSheetFallback: true, limits }, true);
}

const data = workerData as ParseWorkerData | null;
if (parentPort && data?.role === PARSE_WORKER) {
  if (data.warm) {
    warmUp(data.limits);
    parentPort.once("message", (req: ParseRequest) => answer(req, true));
    parentPort.postMessage({ ready: true });
  } else {
    answer(data.request, false);
  }
}
