/**
 * Import benchmark: a 5,000-row materials workbook (header + 4,999 materials,
 * the row limit) through the full import preview (worker-thread parse with
 * limits, validation, matching against the library) vs a bare parse of the
 * same file with `xlsx` in this thread. Prints medians and their ratio.
 * Target: ≤ 1.5×.
 *
 * In the app a warmed, never-used worker waits for the next upload (see
 * lib/spreadsheet/worker.ts); uploads a few seconds apart always find one.
 * The main figure is taken that way (the benchmark waits for the spare
 * between runs, outside the timing); the figure with no spare (the first
 * upload after a start, or GELWRIGHT_IMPORT_SPARE_WORKERS=0) is printed too.
 * Also printed: the growth of this process's resident memory while the
 * largest sheet the limits allow (5,000 rows × 60 columns) is read, and its
 * sizes against the archive caps (lib/spreadsheet/zip-guard.ts).
 */
import { performance } from "node:perf_hooks";
import * as XLSX from "xlsx";
import { referenceMaterials } from "../data/materials";
import { materialsWorkbook } from "../lib/spreadsheet/export-materials";
import { previewMaterialsImport } from "../lib/spreadsheet/import-materials";
import { MATERIALS_INPUT_SHEETS } from "../lib/spreadsheet/template";
import { readWorkbookInWorker, spareWorkersReady } from "../lib/spreadsheet/worker";
import { readCentralDirectory, ZIP_LIMITS } from "../lib/spreadsheet/zip-guard";

const ROWS = 4_999;
const RUNS = 5;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function main() {
  const dispensed = referenceMaterials.filter((m) => m.kind !== "substrate");
  const materials = Array.from({ length: ROWS }, (_, i) => {
    const base = dispensed[i % dispensed.length]!;
    const { sources: _s, casNumber: _c, ...rest } = base;
    void _s; void _c;
    return { ...rest, id: `m${i}`, name: `${base.name} lot ${i}` };
  });
  const bytes = materialsWorkbook(materials);
  const library = referenceMaterials.map((m) => ({ id: m.id, name: m.name, casNumber: m.casNumber ?? null, material: m }));

  const bare: number[] = [];
  const full: number[] = [];
  const parseOnly: number[] = [];
  const cold: number[] = [];
  let problems = 0;
  const importOnce = async () => {
    const t = performance.now();
    const read = await readWorkbookInWorker(new Uint8Array(bytes), MATERIALS_INPUT_SHEETS, { firstSheetFallback: true });
    const parsedMs = performance.now() - t;
    let n = 0;
    const preview = previewMaterialsImport(read.sheets, library, () => `new-${n++}`);
    problems = preview.problems.length;
    return { parsedMs, fullMs: performance.now() - t };
  };
  for (let i = 0; i < RUNS + 1; i++) {
    const t = performance.now();
    const wb = XLSX.read(bytes, { type: "buffer" });
    for (const name of wb.SheetNames) XLSX.utils.sheet_to_json(wb.Sheets[name]!, { header: 1 });
    const bareMs = performance.now() - t;

    await spareWorkersReady();
    const warm = await importOnce();
    if (i > 0) {
      bare.push(bareMs);
      full.push(warm.fullMs);
      parseOnly.push(warm.parsedMs);
    }
  }
  process.env.GELWRIGHT_IMPORT_SPARE_WORKERS = "0";
  for (let i = 0; i < RUNS; i++) cold.push((await importOnce()).fullMs);

  console.log(`\nImport benchmark: ${ROWS} materials, ${(bytes.length / 1024).toFixed(0)} kB workbook, ${RUNS} runs (medians)`);
  console.log(`bare parse (xlsx, this thread)          ${median(bare).toFixed(0).padStart(6)} ms`);
  console.log(`import preview (worker, limits, checks) ${median(full).toFixed(0).padStart(6)} ms  (${problems} problems listed)`);
  console.log(`  of which the worker-thread parse      ${median(parseOnly).toFixed(0).padStart(6)} ms`);
  console.log(`ratio                                   ${(median(full) / median(bare)).toFixed(2).padStart(6)}×   target ≤ 1.5×`);
  console.log(`with no warmed worker waiting           ${median(cold).toFixed(0).padStart(6)} ms  (${(median(cold) / median(bare)).toFixed(2)}×; first upload after a start)`);
  delete process.env.GELWRIGHT_IMPORT_SPARE_WORKERS;
  await largestSheetMemory();
}

/** Resident-memory growth while a full 5,000 × 60 sheet of mixed text and numbers is read. */
async function largestSheetMemory() {
  const MiB = 1024 * 1024;
  const aoa: (string | number)[][] = [];
  for (let r = 0; r < 5000; r++) {
    const row: (string | number)[] = [];
    for (let c = 0; c < 60; c++) row.push(c % 3 === 0 ? `text value ${r}-${c} with some words` : c % 3 === 1 ? (r * 60 + c) / 7 : `r${r}c${c}`);
    aoa.push(row);
  }
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(aoa), "Materials");
  const bytes = XLSX.write(book, { type: "buffer", bookType: "xlsx", compression: true }) as Buffer;
  const sheet = readCentralDirectory(bytes).find((e) => e.name.endsWith("sheet1.xml"))!;
  await spareWorkersReady();
  const before = process.memoryUsage.rss();
  let peak = before;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage.rss())), 5);
  await readWorkbookInWorker(new Uint8Array(bytes), ["Materials"]);
  clearInterval(sampler);
  console.log(
    `5,000 × 60 sheet: ${(bytes.length / MiB).toFixed(1)} MiB file, sheet XML ${(sheet.size / MiB).toFixed(1)} MiB (cap ${ZIP_LIMITS.maxEntryBytes / MiB} MiB per part, ratio ${(sheet.size / sheet.compressedSize).toFixed(1)} : 1, cap ${ZIP_LIMITS.maxRatio} : 1); resident memory +${((peak - before) / MiB).toFixed(0)} MiB at peak over ${(before / MiB).toFixed(0)} MiB`,
  );
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.stack : err);
  process.exit(1);
});
