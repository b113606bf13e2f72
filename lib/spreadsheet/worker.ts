/**
 * Reads .xlsx uploads in a worker thread with a time and memory limit.
 *
 * The npm build of `xlsx` (0.18.5) has published advisories for crafted
 * files (prototype pollution, regular-expression denial of service). So an
 * uploaded workbook is parsed only here: in a separate thread (its own heap,
 * so a polluted prototype never reaches the app; one worker per upload, never
 * reused), capped in memory, stopped
 * after IMPORT_LIMITS.parseMs, reading only the sheets we need, only up to
 * the row and column limits, and only plain values (no formulas, styles,
 * HTML, macros). What comes back is copied into fresh arrays of strings,
 * numbers and booleans; nothing parsed is ever merged into an existing object.
 *
 * Memory is bounded in three ways. The worker's `resourceLimits` cap its
 * JavaScript heap only (Buffers and ArrayBuffers live outside it), so the
 * archive is first checked and unpacked by zip-guard.ts under hard size
 * limits and handed over with every entry stored: `xlsx` then never inflates
 * and never allocates a buffer from a size the file declares, and what the
 * worker holds outside its heap is at most ZIP_LIMITS.maxTotalBytes (the
 * buffer is transferred, not copied). As a second line, a watchdog samples
 * the process's resident memory while a parse runs and stops the worker
 * when it grew by more than GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB (default
 * 768) since the parse began.
 */
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { IMPORT_LIMITS, type ImportLimits } from "./template";
import type { Cell, SheetGrid } from "./types";
import { UploadError } from "@/lib/uploads/upload-error";
import { unpackWorkbook, ZIP_LIMITS, type ZipLimits } from "./zip-guard";

export { UploadError };

interface WorkerRequest {
  bytes: Uint8Array;
  wanted: string[];
  firstSheetFallback: boolean;
  limits: { maxRows: number; maxColumns: number; maxSheets: number; maxCellChars: number };
  moduleRoot: string;
}

type WorkerReply =
  | {
      ok: true;
      sheetNames: string[];
      sheets: { name: string; rows: Cell[][]; truncatedRows: boolean; truncatedColumns: boolean }[];
      threadId: number;
      warmed: boolean;
    }
  | { ok: false; code: string; message: string };

/**
 * The worker's source (CommonJS, run with `eval`), so no bundler has to find a
 * separate file. A worker reads exactly one upload and is then terminated.
 * A spare worker (workerData.warm) loads `xlsx` and reads a small workbook of
 * our own making before it says it is ready, so the upload that takes it does
 * not wait for module loading and a cold compiler; it has never seen anyone's
 * file before that upload.
 */
const WORKER_SOURCE = String.raw`
"use strict";
const { parentPort, workerData, threadId } = require("node:worker_threads");
const { createRequire } = require("node:module");
const XLSX = createRequire(workerData.moduleRoot)("xlsx");
const base = { type: "buffer", cellFormula: false, cellHTML: false, cellText: false, cellStyles: false, cellDates: false,
  cellNF: false, bookVBA: false, bookDeps: false, bookFiles: false, bookProps: false, WTF: false, password: "" };
function readSheet(ws, limits) {
  const rows = [];
  let truncatedRows = false, truncatedColumns = false;
  if (ws && typeof ws["!ref"] === "string") {
    const range = XLSX.utils.decode_range(ws["!ref"]);
    const full = typeof ws["!fullref"] === "string" ? XLSX.utils.decode_range(ws["!fullref"]) : range;
    if (full.e.r + 1 > limits.maxRows) truncatedRows = true;
    if (range.e.c + 1 > limits.maxColumns) truncatedColumns = true;
    const lastRow = Math.min(range.e.r, limits.maxRows - 1);
    const lastCol = Math.min(range.e.c, limits.maxColumns - 1);
    for (let r = 0; r <= lastRow; r++) {
      const row = [];
      const cells = Array.isArray(ws[r]) ? ws[r] : [];
      for (let c = 0; c <= lastCol; c++) {
        const cell = cells[c];
        let v = null;
        if (cell && (cell.t === "n" || cell.t === "b")) v = cell.v;
        else if (cell && (cell.t === "s" || cell.t === "str") && typeof cell.v === "string") v = cell.v.slice(0, limits.maxCellChars + 1);
        row.push(typeof v === "number" || typeof v === "boolean" || typeof v === "string" ? v : null);
      }
      while (row.length > 0 && row[row.length - 1] === null) row.pop();
      rows.push(row);
    }
  }
  return { rows, truncatedRows, truncatedColumns };
}
function read(req) {
  const buffer = Buffer.from(req.bytes.buffer, req.bytes.byteOffset, req.bytes.byteLength);
  let names;
  try {
    names = XLSX.read(buffer, Object.assign({}, base, { bookSheets: true })).SheetNames.map(String);
  } catch (err) {
    const text = String(err && err.message || err);
    if (/password/i.test(text)) return { ok: false, code: "password_protected", message: text };
    return { ok: false, code: "corrupt", message: text };
  }
  if (names.length > req.limits.maxSheets) return { ok: false, code: "too_many_sheets", message: String(names.length) };
  const lower = new Map(names.map((n) => [n.trim().toLowerCase(), n]));
  const selected = [];
  for (const w of req.wanted) { const hit = lower.get(w.toLowerCase()); if (hit !== undefined && !selected.includes(hit)) selected.push(hit); }
  if (selected.length === 0 && req.firstSheetFallback && names.length > 0) selected.push(names[0]);
  // dense: each sheet is an array of rows of cells, faster to read and to walk.
  const wb = XLSX.read(buffer, Object.assign({}, base, { sheets: selected, sheetRows: req.limits.maxRows + 1, dense: true }));
  const sheets = [];
  for (const name of selected) sheets.push(Object.assign({ name: String(name) }, readSheet(wb.Sheets[name], req.limits)));
  return { ok: true, sheetNames: names, sheets, threadId, warmed: workerData.warm === true };
}
function handle(req) {
  let reply;
  try { reply = read(req); } catch (err) { reply = { ok: false, code: "corrupt", message: String(err && err.message || err) }; }
  parentPort.postMessage(reply);
}
if (workerData.warm) {
  // Warm-up on a workbook of our own: a few hundred rows of text and numbers.
  const aoa = [["Name", "Kind", "Molar mass", "Density", "Note"]];
  for (let i = 0; i < 600; i++) aoa.push(["warm-up " + i, i % 2 ? "precursor" : "organic", 100 + i / 7, 0.9 + i / 1000, i % 3 ? "" : "x"]);
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(aoa), "Warm-up");
  const bytes = XLSX.write(book, { type: "buffer", bookType: "xlsx" });
  const limits = workerData.limits;
  for (let i = 0; i < 3; i++) read({ bytes, wanted: ["Warm-up"], firstSheetFallback: true, limits });
  parentPort.once("message", handle);
  parentPort.postMessage({ ready: true });
} else {
  handle(workerData.request);
}
`;

interface WorkerData {
  moduleRoot: string;
  warm: boolean;
  /** The limits a spare reads its warm-up workbook with. */
  limits?: WorkerRequest["limits"];
  request?: WorkerRequest;
}

const RESOURCE_LIMITS = { maxOldGenerationSizeMb: 256, maxYoungGenerationSizeMb: 32, stackSizeMb: 4 };
const defaultModuleRoot = () => join(process.cwd(), "package.json");

/** The limits the worker applies (the time limit is the parent's). */
function workerLimits(limits: ImportLimits): WorkerRequest["limits"] {
  return { maxRows: limits.maxRows, maxColumns: limits.maxColumns, maxSheets: limits.maxSheets, maxCellChars: limits.maxCellChars };
}

/** How many warmed workers wait for the next upload (GELWRIGHT_IMPORT_SPARE_WORKERS, default 1; 0 turns it off). */
function spareTarget(): number {
  const n = Number(process.env.GELWRIGHT_IMPORT_SPARE_WORKERS ?? 1);
  return Number.isInteger(n) && n >= 0 && n <= 4 ? n : 1;
}

interface Spare {
  worker: Worker;
  ready: boolean;
  /** Settles when the spare is warm, or gone. */
  settled: Promise<void>;
}
const spares: Spare[] = [];

/** Starts warming spare workers until there are spareTarget() of them. They never keep the process alive. */
function refillSpares(): void {
  while (spares.length < spareTarget()) {
    const data: WorkerData = { moduleRoot: defaultModuleRoot(), warm: true, limits: workerLimits(IMPORT_LIMITS) };
    const worker = new Worker(WORKER_SOURCE, { eval: true, workerData: data, resourceLimits: RESOURCE_LIMITS });
    worker.unref();
    let settle = () => {};
    const spare: Spare = { worker, ready: false, settled: new Promise<void>((resolve) => (settle = resolve)) };
    const drop = () => {
      const i = spares.indexOf(spare);
      if (i >= 0) spares.splice(i, 1);
      settle();
    };
    worker.once("message", (m: { ready?: boolean }) => {
      if (m && m.ready === true) spare.ready = true;
      settle();
    });
    worker.once("error", drop);
    worker.once("exit", drop);
    spares.push(spare);
  }
}

/**
 * Starts the spare workers if they are not running, and resolves once they
 * are warm (for benchmarks and for warming up at start; uploads never wait for it).
 */
export async function spareWorkersReady(): Promise<number> {
  refillSpares();
  await Promise.all(spares.map((s) => s.settled));
  return spares.filter((s) => s.ready).length;
}

/** A worker that will read `request`: a warmed spare if one is ready, else a new one. */
function workerFor(request: WorkerRequest): Worker {
  const i = spareTarget() > 0 && request.moduleRoot === defaultModuleRoot() ? spares.findIndex((s) => s.ready) : -1;
  if (i >= 0) {
    const [spare] = spares.splice(i, 1);
    spare!.worker.removeAllListeners();
    spare!.worker.ref();
    // The unpacked workbook is handed over, not copied (its buffer is ours alone; see unpackWorkbook).
    spare!.worker.postMessage(request, [request.bytes.buffer as ArrayBuffer]);
    return spare!.worker;
  }
  const data: WorkerData = { moduleRoot: request.moduleRoot, warm: false, request };
  return new Worker(WORKER_SOURCE, { eval: true, workerData: data, resourceLimits: RESOURCE_LIMITS, transferList: [request.bytes.buffer as ArrayBuffer] });
}

/** Result of reading a workbook: sheet names and the sheets asked for. */
export interface WorkbookRead {
  sheetNames: string[];
  /** The worker that read it (each upload has its own) and whether it was a warmed spare. */
  worker: { threadId: number; warmed: boolean };
  sheets: (SheetGrid & { truncatedRows: boolean; truncatedColumns: boolean })[];
}

/** The watchdog's settings: resident-memory growth allowed during one parse, and how often it looks. */
export interface MemoryWatch {
  headroomBytes: number;
  sampleMs: number;
  /** The process's resident memory in bytes (replaceable in tests). */
  rss: () => number;
}

/** GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB (default 768; a whole number from 64 to 65,536). */
export function memoryHeadroomBytes(): number {
  const raw = process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB;
  const n = raw === undefined || raw === "" ? 768 : Number(raw);
  return (Number.isInteger(n) && n >= 64 && n <= 65_536 ? n : 768) * 1024 * 1024;
}

/**
 * Parses an .xlsx file in a worker thread, reading only `wanted` sheets
 * (matched without regard to case); with `firstSheetFallback`, the first
 * sheet when none of them is present. The archive is checked and unpacked
 * under ZIP_LIMITS first (zip-guard.ts). Rejects with an UploadError.
 *
 * @example
 * ```ts
 * const { sheets } = await readWorkbookInWorker(bytes, ["Materials"], { firstSheetFallback: true });
 * ```
 */
export async function readWorkbookInWorker(
  bytes: Uint8Array,
  wanted: readonly string[],
  opts: { firstSheetFallback?: boolean; limits?: ImportLimits; zipLimits?: ZipLimits; moduleRoot?: string; memory?: Partial<MemoryWatch> } = {},
): Promise<WorkbookRead> {
  const limits = opts.limits ?? IMPORT_LIMITS;
  const stored = await unpackWorkbook(bytes, opts.zipLimits ?? ZIP_LIMITS);
  const watch: MemoryWatch = {
    headroomBytes: opts.memory?.headroomBytes ?? memoryHeadroomBytes(),
    sampleMs: opts.memory?.sampleMs ?? 50,
    rss: opts.memory?.rss ?? (() => process.memoryUsage.rss()),
  };
  const request: WorkerRequest = {
    bytes: stored,
    wanted: [...wanted],
    firstSheetFallback: opts.firstSheetFallback ?? false,
    limits: workerLimits(limits),
    moduleRoot: opts.moduleRoot ?? defaultModuleRoot(),
  };
  return new Promise<WorkbookRead>((resolve, reject) => {
    const rssAtStart = watch.rss();
    const worker = workerFor(request);
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      clearInterval(watchdog);
      void worker.terminate();
      fn();
      // The next upload's worker warms up after this one is done, not while it parses.
      refillSpares();
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
    const watchdog = setInterval(() => {
      const grown = watch.rss() - rssAtStart;
      if (grown <= watch.headroomBytes) return;
      finish(() =>
        reject(
          new UploadError(
            413,
            "too_much_memory",
            `Reading this workbook needed more than ${Math.round(watch.headroomBytes / 1024 / 1024)} MB of memory and was stopped. Remove unused sheets, images or rows and upload it again.`,
          ),
        ),
      );
    }, watch.sampleMs);
    watchdog.unref();
    worker.once("message", (message: WorkerReply) => {
      finish(() => {
        if (message.ok) {
          resolve({
            sheetNames: message.sheetNames.map(String),
            worker: { threadId: Number(message.threadId), warmed: message.warmed === true },
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
            ? new UploadError(413, "too_much_memory", "This workbook needs too much memory to read. Remove unused sheets or rows and upload it again.")
            : new UploadError(422, "corrupt_file", "This file could not be read as an .xlsx workbook: it is damaged or not a workbook."),
        ),
      );
    });
    worker.once("exit", (code) => {
      finish(() => reject(new UploadError(422, "corrupt_file", `Reading the workbook stopped unexpectedly (code ${code}).`)));
    });
  });
}
