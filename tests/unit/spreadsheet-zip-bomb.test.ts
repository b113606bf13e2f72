/**
 * Zip bombs and lying zip headers in .xlsx uploads. An .xlsx file is a zip
 * archive; a few MB of deflated repeated bytes can unpack to gigabytes, and
 * nothing forces a header to state the true size. Every archive is checked
 * from its central directory before anything is unpacked, and every entry is
 * unpacked by us with its declared size as a hard limit (PKWARE APPNOTE.TXT
 * for the layout; zip bomb: common knowledge, no source). Memory figures are
 * printed; the assertions are on memory, never on time.
 */
import { describe, expect, it } from "vitest";
import { readUpload, UploadError } from "@/lib/spreadsheet/read";
import { IMPORT_LIMITS, MATERIALS_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import { memoryHeadroomBytes, readWorkbookInWorker } from "@/lib/spreadsheet/worker";
import { ZIP_LIMITS } from "@/lib/spreadsheet/zip-guard";
import { bombSheet, deflated, SHEET_PATH, workbookEntries, workbookWith, writeZip, type RawEntry } from "../helpers/zip";

const MiB = 1024 * 1024;
/** How far the test process's memory may grow while one bomb is refused. */
const BOUND = 128 * MiB;

const read = (bytes: Uint8Array) =>
  readUpload(bytes, "bomb.xlsx", { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials, firstSheetFallback: true, limits: IMPORT_LIMITS });

/** Reads `bytes`, expecting a refusal, and measures the peak growth of this process's resident memory meanwhile. */
async function refusedWithin(bytes: Uint8Array, label: string): Promise<UploadError> {
  global.gc?.();
  const before = process.memoryUsage.rss();
  let peak = before;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage.rss())), 5);
  const err = await read(bytes).then(
    () => null,
    (e: unknown) => e,
  );
  clearInterval(sampler);
  peak = Math.max(peak, process.memoryUsage.rss());
  console.log(
    `${label}: file ${(bytes.byteLength / MiB).toFixed(2)} MiB, resident memory ${(before / MiB).toFixed(0)} MiB before, peak +${((peak - before) / MiB).toFixed(1)} MiB, answer ${err instanceof UploadError ? `${err.status} ${err.code}` : String(err)}`,
  );
  expect(peak - before, `${label}: memory growth`).toBeLessThan(BOUND);
  expect(err).toBeInstanceOf(UploadError);
  return err as UploadError;
}

describe("zip bombs in .xlsx uploads", () => {
  it("refuses a 2 MB workbook whose sheet unpacks to 2,000 MiB with 413, and memory stays bounded", async () => {
    const bomb = workbookWith(bombSheet(2000));
    expect(bomb.byteLength).toBeLessThan(IMPORT_LIMITS.maxBytes);
    const err = await refusedWithin(bomb, "2,000 MiB bomb");
    expect([err.status, err.code]).toEqual([413, "unpacks_too_large"]);
    expect(err.message).toContain(SHEET_PATH);
    expect(err.message).toMatch(/2,000 MB|2,097 MB|MB when unpacked/);
  });

  it("refuses a sheet whose headers declare 1,000 bytes but which inflates to 300 MiB, with 422 and bounded memory", async () => {
    const sheet: RawEntry = { ...bombSheet(300), centralSize: 1000, localSize: 1000 };
    const err = await refusedWithin(workbookWith(sheet), "lying sizes (1,000 bytes declared)");
    expect([err.status, err.code]).toEqual([422, "size_mismatch"]);
    expect(err.message).toContain(SHEET_PATH);
  });

  it("refuses a sheet whose local header says 0 bytes (sizes in a data descriptor) but which inflates to 300 MiB", async () => {
    const sheet: RawEntry = { ...bombSheet(300), centralSize: 1000, localSize: 0, localFlags: 8 };
    const err = await refusedWithin(workbookWith(sheet), "lying sizes (0 in the local header)");
    expect([err.status, err.code]).toEqual([422, "size_mismatch"]);
  });

  it("refuses a total over the cap even when every entry is under the per-entry cap", async () => {
    const n = Math.floor(ZIP_LIMITS.maxTotalBytes / ZIP_LIMITS.maxEntryBytes) + 1;
    const parts = Array.from({ length: n }, (_, i) => ({ ...bombSheet(ZIP_LIMITS.maxEntryBytes / MiB - 1), name: `xl/media/filler${i}.bin` }));
    const err = await refusedWithin(writeZip([...workbookEntries(), ...parts]), `${n} entries of ${ZIP_LIMITS.maxEntryBytes / MiB - 1} MiB`);
    expect([err.status, err.code]).toEqual([413, "unpacks_too_large"]);
    expect(err.message).toMatch(/in all/);
  });

  it("refuses too many entries with 422", async () => {
    const filler = Array.from({ length: ZIP_LIMITS.maxEntries }, (_, i) => deflated(`xl/media/f${i}.txt`, "x"));
    const err = await refusedWithin(writeZip([...workbookEntries(), ...filler]), `${ZIP_LIMITS.maxEntries + 11} entries`);
    expect([err.status, err.code]).toEqual([422, "too_many_entries"]);
    expect(err.message).toContain(ZIP_LIMITS.maxEntries.toLocaleString("en"));
  });

  it("refuses an extreme compression ratio with 413 even under the size caps", async () => {
    const sheet = bombSheet(ZIP_LIMITS.maxEntryBytes / MiB - 1);
    const err = await refusedWithin(workbookWith(sheet), "ratio about 1,000:1");
    expect([err.status, err.code]).toEqual([413, "compression_ratio"]);
  });

  describe("edge cases", () => {
    it("refuses a ZIP64 archive with 422", async () => {
      const entries = workbookEntries().map((e) => (e.name === SHEET_PATH ? { ...e, zip64: true } : e));
      const err = await refusedWithin(writeZip(entries), "ZIP64 marker");
      expect([err.status, err.code]).toEqual([422, "zip64"]);
    });

    it("refuses a central directory that points outside the file, and a bad checksum, as damaged", async () => {
      const good = writeZip(workbookEntries());
      const broken = Buffer.from(good);
      broken.writeUInt32LE(good.length + 10, good.length - 6); // start of the central directory
      expect((await refusedWithin(broken, "central directory outside the file")).code).toBe("corrupt_file");
      const badCrc = workbookEntries().map((e) => (e.name === SHEET_PATH ? { ...e, crc: (e.crc ^ 1) >>> 0 } : e));
      expect((await refusedWithin(writeZip(badCrc), "bad checksum")).code).toBe("corrupt_file");
    });

    it("stops a parse whose process memory grows past the watchdog's headroom, with 413", async () => {
      // The second line behind the archive checks: resident memory is sampled while the worker parses.
      // A stand-in memory reading jumps by 2 GiB after the start, as a parse out of control would.
      let calls = 0;
      const rss = () => (calls++ === 0 ? 100 * MiB : 100 * MiB + 2048 * MiB);
      process.env.GELWRIGHT_IMPORT_SPARE_WORKERS = "0"; // a cold worker: loading xlsx alone outlasts several samples
      try {
        const err = await readWorkbookInWorker(writeZip(workbookEntries()), ["Materials"], { memory: { headroomBytes: 768 * MiB, sampleMs: 1, rss } }).then(
          () => null,
          (e: unknown) => e,
        );
        expect(err).toBeInstanceOf(UploadError);
        expect([(err as UploadError).status, (err as UploadError).code]).toEqual([413, "too_much_memory"]);
        expect((err as UploadError).message).toContain("768 MB");
      } finally {
        delete process.env.GELWRIGHT_IMPORT_SPARE_WORKERS;
      }
    });

    it("takes the watchdog's headroom from GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB (768 MB unset), and refuses anything out of range", () => {
      const saved = process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB;
      try {
        for (const [setting, mb] of [[undefined, 768], ["", 768], ["1024", 1024], ["64", 64]] as const) {
          if (setting === undefined) delete process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB;
          else process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB = setting;
          expect(memoryHeadroomBytes(), String(setting)).toBe(mb * MiB);
        }
        for (const setting of ["63", "1.5", "lots", "70000"]) {
          process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB = setting;
          expect(() => memoryHeadroomBytes(), setting).toThrow(`GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB=“${setting}”: expected a whole number from 64 to 65,536`);
        }
      } finally {
        if (saved === undefined) delete process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB;
        else process.env.GELWRIGHT_IMPORT_MEMORY_HEADROOM_MB = saved;
      }
    });

    it("still reads an honest workbook written by our small zip writer", async () => {
      const parsed = await read(writeZip(workbookEntries()));
      expect(parsed.sheets[0]!.rows).toEqual([["Name", "Kind"], ["Ethanol", "solvent"]]);
    });
  });
});
