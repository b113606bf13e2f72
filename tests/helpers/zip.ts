/**
 * A small zip writer for tests that need archives no honest program writes:
 * zip bombs (hundreds of MB of repeated bytes deflated to a few MB), entries
 * whose headers lie about their size, too many entries, ZIP64 markers.
 * Follows PKWARE's APPNOTE.TXT (local file header, central directory,
 * end-of-central-directory record).
 */
import * as XLSX from "xlsx";
import { constants, crc32, deflateRawSync } from "node:zlib";

/** One entry as it goes into the archive. */
export interface RawEntry {
  name: string;
  method: 0 | 8;
  /** The bytes stored (deflated when method is 8). */
  data: Buffer;
  crc: number;
  /** The true uncompressed size. */
  size: number;
  /** Sizes to write instead of the true ones (a lying header). */
  centralSize?: number;
  localSize?: number;
  /** General-purpose flags of the local header (8: sizes in a data descriptor, so zero here). */
  localFlags?: number;
  /** Writes 0xFFFFFFFF sizes in the central directory, as ZIP64 archives do. */
  zip64?: boolean;
}

/** An entry deflated normally. */
export function deflated(name: string, content: Buffer | string): RawEntry {
  const bytes = typeof content === "string" ? Buffer.from(content, "utf8") : content;
  return { name, method: 8, data: deflateRawSync(bytes), crc: crc32(bytes), size: bytes.length };
}

/**
 * An entry of `head`, then `chunk` repeated `times`, then `tail`, deflated
 * without ever holding the whole: each piece is compressed on its own with a
 * full flush (byte-aligned, no reference to earlier data), so the compressed
 * chunk can simply be repeated. 1 MiB of one repeated byte deflates to about 1 KiB.
 */
export function repeated(name: string, head: string, chunk: Buffer, times: number, tail: string): RawEntry {
  const flush = { finishFlush: constants.Z_FULL_FLUSH };
  const h = Buffer.from(head, "utf8");
  const t = Buffer.from(tail, "utf8");
  const parts = [deflateRawSync(h, flush)];
  const c = deflateRawSync(chunk, flush);
  for (let i = 0; i < times; i++) parts.push(c);
  parts.push(deflateRawSync(t));
  let crc = crc32(h);
  for (let i = 0; i < times; i++) crc = crc32(chunk, crc);
  crc = crc32(t, crc);
  return { name, method: 8, data: Buffer.concat(parts), crc, size: h.length + chunk.length * times + t.length };
}

/** Writes a zip archive of the entries, in order. */
export function writeZip(entries: readonly RawEntry[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.from(e.name, "utf8");
    const flags = e.localFlags ?? 0;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(flags, 6);
    local.writeUInt16LE(e.method, 8);
    local.writeUInt32LE(0, 10); // time and date
    local.writeUInt32LE(flags & 8 ? 0 : e.crc >>> 0, 14);
    local.writeUInt32LE(flags & 8 ? 0 : e.data.length, 18);
    local.writeUInt32LE(flags & 8 ? 0 : (e.localSize ?? e.size) >>> 0, 22);
    local.writeUInt16LE(name.length, 26);
    local.writeUInt16LE(0, 28);
    const descriptor = Buffer.alloc(flags & 8 ? 16 : 0);
    if (flags & 8) {
      descriptor.writeUInt32LE(0x08074b50, 0);
      descriptor.writeUInt32LE(e.crc >>> 0, 4);
      descriptor.writeUInt32LE(e.data.length, 8);
      descriptor.writeUInt32LE((e.localSize ?? e.size) >>> 0, 12);
    }
    locals.push(local, name, e.data, descriptor);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(flags, 8);
    central.writeUInt16LE(e.method, 10);
    central.writeUInt32LE(0, 12);
    central.writeUInt32LE(e.crc >>> 0, 16);
    central.writeUInt32LE(e.zip64 ? 0xffffffff : e.data.length, 20);
    central.writeUInt32LE(e.zip64 ? 0xffffffff : (e.centralSize ?? e.size) >>> 0, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += local.length + name.length + e.data.length + descriptor.length;
  }
  const cd = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length & 0xffff, 8);
  end.writeUInt16LE(entries.length & 0xffff, 10);
  end.writeUInt32LE(cd.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, cd, end]);
}

/** The entries of a small real workbook (one "Materials" sheet), deflated, to build on. */
export function workbookEntries(): RawEntry[] {
  const book = XLSX.utils.book_new();
  XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet([["Name", "Kind"], ["Ethanol", "solvent"]]), "Materials");
  const bytes = XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
  const zip = XLSX.CFB.read(bytes, { type: "buffer" });
  const out: RawEntry[] = [];
  zip.FileIndex.forEach((file: { type: number; content?: unknown }, i: number) => {
    if (file.type !== 2 || !file.content || zip.FullPaths[i]!.includes("\u0001")) return;
    out.push(deflated(zip.FullPaths[i]!.replace(/^[^/]*\//, ""), Buffer.from(file.content as Uint8Array)));
  });
  return out;
}

export const SHEET_PATH = "xl/worksheets/sheet1.xml";
const SHEET_HEAD = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData><row r="1"><c r="A1" t="inlineStr"><is><t>';
const SHEET_TAIL = "</t></is></c></row></sheetData></worksheet>";

/** A sheet whose one cell holds `mib` MiB of the letter A, deflated to about `mib` KiB. */
export function bombSheet(mib: number): RawEntry {
  return repeated(SHEET_PATH, SHEET_HEAD, Buffer.alloc(1024 * 1024, 0x41), mib, SHEET_TAIL);
}

/** A workbook with its sheet replaced by `sheet`. */
export function workbookWith(sheet: RawEntry): Buffer {
  return writeZip(workbookEntries().map((e) => (e.name === SHEET_PATH ? sheet : e)));
}
