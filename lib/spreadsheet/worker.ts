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
import type { Worker } from "node:worker_threads";
import { settings } from "@/lib/settings";
import { startTypeScriptWorker } from "@/lib/worker-threads";
import type { ParseLimits, ParseReply, ParseRequest, ParseWorkerData } from "./parse-worker";
import { PARSE_WORKER } from "./parse-worker-role";
import { IMPORT_LIMITS, type ImportLimits } from "./template";
import type { SheetGrid } from "./types";
import { UploadError } from "@/lib/uploads/upload-error";
import { unpackWorkbook, ZIP_LIMITS, type ZipLimits } from "./zip-guard";

export { UploadError };

/** The worker's memory: its JavaScript heap and stack (Buffers live outside; see above). */
const RESOURCE_LIMITS = { maxOldGenerationSizeMb: 256, maxYoungGenerationSizeMb: 32, stackSizeMb: 4 };

/** Starts a worker (lib/spreadsheet/parse-worker.ts) with `data`, handing `transfer` over. */
function startWorker(data: ParseWorkerData, transfer: ArrayBuffer[] = []): Worker {
  return startTypeScriptWorker(import.meta.url, "./parse-worker.ts", { workerData: data, resourceLimits: RESOURCE_LIMITS, transferList: transfer });
}

/** The limits the worker applies (the time limit is the parent's). */
function workerLimits(limits: ImportLimits): ParseLimits {
  return { maxRows: limits.maxRows, maxColumns: limits.maxColumns, maxSheets: limits.maxSheets, maxCellChars: limits.maxCellChars };
}

/** How many warmed workers wait for the next upload (GELWRIGHT_IMPORT_SPARE_WORKERS, default 1; 0 turns it off). */
function spareTarget(): number {
  return settings().workers.importSpares;
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
    const worker = startWorker({ role: PARSE_WORKER, warm: true, limits: workerLimits(IMPORT_LIMITS) });
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
function workerFor(request: ParseRequest): Worker {
  const i = spareTarget() > 0 ? spares.findIndex((s) => s.ready) : -1;
  if (i >= 0) {
    const [spare] = spares.splice(i, 1);
    spare!.worker.removeAllListeners();
    spare!.worker.ref();
    // The unpacked workbook is handed over, not copied (its buffer is ours alone; see unpackWorkbook).
    spare!.worker.postMessage(request, [request.bytes.buffer as ArrayBuffer]);
    return spare!.worker;
  }
  return startWorker({ role: PARSE_WORKER, warm: false, request }, [request.bytes.buffer as ArrayBuffer]);
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

/** GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB (default 768; a whole number from 64 to 65,536), in bytes. */
export function memoryHeadroomBytes(): number {
  return settings().workers.importMemoryHeadroomMb * 1024 * 1024;
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
  opts: { firstSheetFallback?: boolean; limits?: ImportLimits; zipLimits?: ZipLimits; memory?: Partial<MemoryWatch> } = {},
): Promise<WorkbookRead> {
  const limits = opts.limits ?? IMPORT_LIMITS;
  const stored = await unpackWorkbook(bytes, opts.zipLimits ?? ZIP_LIMITS);
  const watch: MemoryWatch = {
    headroomBytes: opts.memory?.headroomBytes ?? memoryHeadroomBytes(),
    sampleMs: opts.memory?.sampleMs ?? 50,
    rss: opts.memory?.rss ?? (() => process.memoryUsage.rss()),
  };
  const request: ParseRequest = {
    bytes: stored,
    wanted: [...wanted],
    firstSheetFallback: opts.firstSheetFallback ?? false,
    limits: workerLimits(limits),
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
    worker.once("message", (message: ParseReply) => {
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
