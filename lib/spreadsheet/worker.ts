/**
 * Reads .xlsx uploads in a worker thread with a time and memory limit.
 *
 * The npm build of `xlsx` (0.18.5) has published advisories for crafted
 * files (prototype pollution, regular-expression denial of service). So an
 * uploaded workbook is parsed only here: in a separate thread (its own heap,
 * so a polluted prototype never reaches the app), capped in memory, stopped
 * after IMPORT_LIMITS.parseMs, reading only the sheets we need, only up to
 * the row and column limits, and only plain values (no formulas, styles,
 * HTML, macros). What comes back is copied into fresh arrays of strings,
 * numbers and booleans; nothing parsed is ever merged into an existing object.
 */
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { IMPORT_LIMITS, type ImportLimits } from "./template";
import type { Cell, SheetGrid } from "./types";

/** A problem with an upload as a whole; `status` is the HTTP status to answer with. */
export class UploadError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "UploadError";
  }
}

interface WorkerRequest {
  bytes: Uint8Array;
  wanted: string[];
  firstSheetFallback: boolean;
  limits: { maxRows: number; maxColumns: number; maxSheets: number; maxCellChars: number };
  moduleRoot: string;
}

type WorkerReply =
  | { ok: true; sheetNames: string[]; sheets: { name: string; rows: Cell[][]; truncatedRows: boolean; truncatedColumns: boolean }[] }
  | { ok: false; code: string; message: string };

/** The worker's source (CommonJS, run with `eval`), so no bundler has to find a separate file. */
const WORKER_SOURCE = String.raw`
"use strict";
const { parentPort, workerData } = require("node:worker_threads");
const { createRequire } = require("node:module");
const req = workerData;
function reply(value) { parentPort.postMessage(value); }
(function main() {
try {
  const XLSX = createRequire(req.moduleRoot)("xlsx");
  const base = { type: "buffer", cellFormula: false, cellHTML: false, cellText: false, cellStyles: false, cellDates: false,
    cellNF: false, bookVBA: false, bookDeps: false, bookFiles: false, bookProps: false, WTF: false, password: "" };
  const buffer = Buffer.from(req.bytes.buffer, req.bytes.byteOffset, req.bytes.byteLength);
  let names;
  try {
    names = XLSX.read(buffer, Object.assign({}, base, { bookSheets: true })).SheetNames.map(String);
  } catch (err) {
    const text = String(err && err.message || err);
    if (/password/i.test(text)) reply({ ok: false, code: "password_protected", message: text });
    else reply({ ok: false, code: "corrupt", message: text });
    return;
  }
  if (names.length > req.limits.maxSheets) { reply({ ok: false, code: "too_many_sheets", message: String(names.length) }); return; }
  const lower = new Map(names.map((n) => [n.trim().toLowerCase(), n]));
  const selected = [];
  for (const w of req.wanted) { const hit = lower.get(w.toLowerCase()); if (hit !== undefined && !selected.includes(hit)) selected.push(hit); }
  if (selected.length === 0 && req.firstSheetFallback && names.length > 0) selected.push(names[0]);
  const wb = XLSX.read(buffer, Object.assign({}, base, { sheets: selected, sheetRows: req.limits.maxRows + 1 }));
  const sheets = [];
  for (const name of selected) {
    const ws = wb.Sheets[name];
    const rows = [];
    let truncatedRows = false, truncatedColumns = false;
    if (ws && typeof ws["!ref"] === "string") {
      const range = XLSX.utils.decode_range(ws["!ref"]);
      const full = typeof ws["!fullref"] === "string" ? XLSX.utils.decode_range(ws["!fullref"]) : range;
      if (full.e.r + 1 > req.limits.maxRows) truncatedRows = true;
      if (range.e.c + 1 > req.limits.maxColumns) truncatedColumns = true;
      const lastRow = Math.min(range.e.r, req.limits.maxRows - 1);
      const lastCol = Math.min(range.e.c, req.limits.maxColumns - 1);
      for (let r = 0; r <= lastRow; r++) {
        const row = [];
        for (let c = 0; c <= lastCol; c++) {
          const cell = ws[XLSX.utils.encode_cell({ r, c })];
          let v = null;
          if (cell && (cell.t === "n" || cell.t === "b")) v = cell.v;
          else if (cell && (cell.t === "s" || cell.t === "str") && typeof cell.v === "string") v = cell.v.slice(0, req.limits.maxCellChars + 1);
          row.push(typeof v === "number" || typeof v === "boolean" || typeof v === "string" ? v : null);
        }
        while (row.length > 0 && row[row.length - 1] === null) row.pop();
        rows.push(row);
      }
    }
    sheets.push({ name: String(name), rows, truncatedRows, truncatedColumns });
  }
  reply({ ok: true, sheetNames: names, sheets });
} catch (err) {
  reply({ ok: false, code: "corrupt", message: String(err && err.message || err) });
}
})();
`;

/** Result of reading a workbook: sheet names and the sheets asked for. */
export interface WorkbookRead {
  sheetNames: string[];
  sheets: (SheetGrid & { truncatedRows: boolean; truncatedColumns: boolean })[];
}

/**
 * Parses an .xlsx file in a worker thread, reading only `wanted` sheets
 * (matched without regard to case); with `firstSheetFallback`, the first
 * sheet when none of them is present. Rejects with an UploadError.
 *
 * @example
 * ```ts
 * const { sheets } = await readWorkbookInWorker(bytes, ["Materials"], { firstSheetFallback: true });
 * ```
 */
export function readWorkbookInWorker(
  bytes: Uint8Array,
  wanted: readonly string[],
  opts: { firstSheetFallback?: boolean; limits?: ImportLimits; moduleRoot?: string } = {},
): Promise<WorkbookRead> {
  const limits = opts.limits ?? IMPORT_LIMITS;
  const request: WorkerRequest = {
    bytes,
    wanted: [...wanted],
    firstSheetFallback: opts.firstSheetFallback ?? false,
    limits: { maxRows: limits.maxRows, maxColumns: limits.maxColumns, maxSheets: limits.maxSheets, maxCellChars: limits.maxCellChars },
    moduleRoot: opts.moduleRoot ?? join(process.cwd(), "package.json"),
  };
  return new Promise<WorkbookRead>((resolve, reject) => {
    const worker = new Worker(WORKER_SOURCE, {
      eval: true,
      workerData: request,
      resourceLimits: { maxOldGenerationSizeMb: 256, maxYoungGenerationSizeMb: 32, stackSizeMb: 4 },
    });
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void worker.terminate();
      fn();
    };
    const timer = setTimeout(() => {
      finish(() =>
        reject(
          new UploadError(
            422,
            "parse_timeout",
            `Reading this workbook took longer than ${limits.parseMs / 1000} s and was stopped. Remove unused sheets or save it again as a plain .xlsx file, then upload it again.`,
          ),
        ),
      );
    }, limits.parseMs);
    worker.once("message", (message: WorkerReply) => {
      finish(() => {
        if (message.ok) {
          resolve({
            sheetNames: message.sheetNames.map(String),
            sheets: message.sheets.map((s) => ({
              name: String(s.name),
              rows: s.rows.map((row) => row.map((cell) => (typeof cell === "string" || typeof cell === "number" || typeof cell === "boolean" ? cell : null))),
              truncatedRows: s.truncatedRows === true,
              truncatedColumns: s.truncatedColumns === true,
            })),
          });
        } else if (message.code === "password_protected") {
          reject(new UploadError(422, "password_protected", "This workbook is protected with a password. Remove the password in your spreadsheet program, save, and upload it again."));
        } else if (message.code === "too_many_sheets") {
          reject(new UploadError(422, "too_many_sheets", `This workbook has ${message.message} sheets; at most ${limits.maxSheets} are accepted.`));
        } else {
          reject(new UploadError(422, "corrupt_file", "This file could not be read as an .xlsx workbook: it is damaged or not a workbook. Open it in your spreadsheet program, save it as .xlsx and upload it again."));
        }
      });
    });
    worker.once("error", (err: Error & { code?: string }) => {
      finish(() =>
        reject(
          err.code === "ERR_WORKER_OUT_OF_MEMORY"
            ? new UploadError(422, "too_large", "This workbook needs too much memory to read. Remove unused sheets or rows and upload it again.")
            : new UploadError(422, "corrupt_file", "This file could not be read as an .xlsx workbook: it is damaged or not a workbook."),
        ),
      );
    });
    worker.once("exit", (code) => {
      finish(() => reject(new UploadError(422, "corrupt_file", `Reading the workbook stopped unexpectedly (code ${code}).`)));
    });
  });
}
