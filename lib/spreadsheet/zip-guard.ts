/**
 * Checks an .xlsx file (a zip archive) before any of it is unpacked, and
 * unpacks it ourselves under hard limits, so that `xlsx` never inflates
 * anything.
 *
 * A few MB of deflated repeated bytes can unpack to gigabytes (a zip bomb),
 * and the sizes a zip header declares are only claims: `xlsx` 0.18.5 (its
 * bundled CFB code, `parse_zip`) allocates the size the local header declares
 * and, when that size is 0 (as with a data descriptor), keeps growing its
 * buffer for as long as the data inflates. So:
 *
 * 1. `readCentralDirectory` reads the end-of-central-directory record and
 *    every central directory entry (PKWARE APPNOTE.TXT, sections 4.3.12–4.3.16)
 *    and refuses ZIP64, split or encrypted archives, more than
 *    ZIP_LIMITS.maxEntries entries, any entry or a total whose declared
 *    uncompressed size is over the caps, an extreme compression ratio, and
 *    local headers that disagree with the central directory.
 * 2. `unpackWorkbook` inflates each entry with node:zlib, its declared size as
 *    `maxOutputLength`: an entry that inflates beyond its declared size is
 *    stopped there and refused, so the declared-size check cannot be bypassed.
 *    The CRC-32 of each entry is checked. The result is the same archive with
 *    every entry stored (not compressed), which is what the worker hands to
 *    `xlsx`: it then only slices the buffer and never inflates.
 *
 * Inflation runs on libuv's thread pool (asynchronous zlib), not in the
 * request's thread.
 */
import { promisify } from "node:util";
import { crc32, inflateRaw, type InputType, type ZlibOptions } from "node:zlib";
import { UploadError } from "@/lib/uploads/upload-error";

const inflateRawAsync = promisify(inflateRaw) as (buffer: InputType, options: ZlibOptions) => Promise<Buffer>;

const MiB = 1024 * 1024;

/** Limits on the archive inside an .xlsx upload. */
export interface ZipLimits {
  /** Entries (parts) in the archive. */
  maxEntries: number;
  /** Declared uncompressed size of one entry, bytes. */
  maxEntryBytes: number;
  /** Declared uncompressed size of all entries together, bytes. */
  maxTotalBytes: number;
  /** Uncompressed : compressed size of one entry, for entries above ratioFloorBytes. */
  maxRatio: number;
  /** Entries smaller than this (bytes) may compress as well as they like. */
  ratioFloorBytes: number;
}

/**
 * The caps. A full 5,000-row × 60-column sheet written by `xlsx` is about
 * 15 MB of sheet XML (mixed text and numbers; measured 2026-12-02), or 11 MB
 * plus 7 MB of shared strings; real workbooks have a few dozen entries (one
 * per sheet, relationships, styles, theme, images). Deflate cannot compress
 * better than about 1,032 : 1; spreadsheet XML typically compresses 3–30 : 1
 * (common practice, no source).
 */
export const ZIP_LIMITS: Readonly<ZipLimits> = {
  /** 1,000 entries: 20 sheets with their relationships, drawings and images fit many times over. */
  maxEntries: 1_000,
  /** 64 MiB per entry: four times the largest sheet the row and column limits allow. */
  maxEntryBytes: 64 * MiB,
  /** 128 MiB in all: bounds what the parse can be handed, whatever the entries. */
  maxTotalBytes: 128 * MiB,
  /** 200 : 1 for entries over 1 MiB: well above real sheets, far below a bomb's ~1,000 : 1. */
  maxRatio: 200,
  ratioFloorBytes: 1 * MiB,
};

/** One entry as the central directory describes it. */
export interface ZipEntry {
  /** Name as raw bytes (kept exactly as written) and as text for messages. */
  nameBytes: Buffer;
  name: string;
  method: 0 | 8;
  flags: number;
  /** DOS time and date, as written. */
  modified: number;
  crc: number;
  compressedSize: number;
  size: number;
  /** Where the entry's compressed data starts in the file. */
  dataStart: number;
}

const SIG_EOCD = 0x06054b50;
const SIG_ZIP64_LOCATOR = 0x07064b50;
const SIG_CENTRAL = 0x02014b50;
const SIG_LOCAL = 0x04034b50;
const EOCD_BYTES = 22;
const CENTRAL_BYTES = 46;
const LOCAL_BYTES = 30;
const MAX_COMMENT = 0xffff;

const AGAIN = "Open it in your spreadsheet program, save it as .xlsx and upload it again.";

function damaged(detail: string): UploadError {
  return new UploadError(422, "corrupt_file", `This file could not be read as an .xlsx workbook: ${detail}. ${AGAIN}`);
}

function zip64(): UploadError {
  return new UploadError(
    422,
    "zip64",
    `This workbook is stored in the ZIP64 format, which only archives over 4 GB need; a workbook within the limits never does. ${AGAIN}`,
  );
}

/** A part's name, safe to show: printable characters only, at most 80 of them. */
function shown(name: string): string {
  const clean = name.replace(/[^\x20-\x7e\u00a0-\uffff]/g, "?");
  return clean.length > 80 ? `${clean.slice(0, 80)}…` : clean;
}

function mb(bytes: number): string {
  return `${(bytes / MiB).toLocaleString("en", { maximumFractionDigits: bytes < 10 * MiB ? 1 : 0 })} MB`;
}

/**
 * Reads and checks the central directory of a zip archive without unpacking
 * anything; throws an UploadError (413 or 422) naming what is wrong.
 *
 * @example
 * ```ts
 * const entries = readCentralDirectory(bytes); // [{ name: "[Content_Types].xml", size: 1234, … }, …]
 * ```
 */
export function readCentralDirectory(bytes: Uint8Array, limits: ZipLimits = ZIP_LIMITS): ZipEntry[] {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let eocd = -1;
  for (let i = buf.length - EOCD_BYTES, stop = Math.max(0, buf.length - EOCD_BYTES - MAX_COMMENT); i >= stop; i--) {
    if (buf.readUInt32LE(i) === SIG_EOCD) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) throw damaged("its table of contents (the zip central directory) is missing");
  if (eocd >= 20 && buf.readUInt32LE(eocd - 20) === SIG_ZIP64_LOCATOR) throw zip64();
  const disk = buf.readUInt16LE(eocd + 4);
  const cdDisk = buf.readUInt16LE(eocd + 6);
  const onDisk = buf.readUInt16LE(eocd + 8);
  const count = buf.readUInt16LE(eocd + 10);
  const cdSize = buf.readUInt32LE(eocd + 12);
  const cdOffset = buf.readUInt32LE(eocd + 16);
  if (count === 0xffff || cdSize === 0xffffffff || cdOffset === 0xffffffff) throw zip64();
  if (disk !== 0 || cdDisk !== 0 || onDisk !== count) throw damaged("it is one part of an archive split over several files");
  if (count > limits.maxEntries) {
    throw new UploadError(
      422,
      "too_many_entries",
      `This workbook is an archive of ${count.toLocaleString("en")} parts; at most ${limits.maxEntries.toLocaleString("en")} are accepted. Remove unused sheets and images, save it again and upload it.`,
    );
  }
  if (count === 0) throw damaged("the archive is empty");
  if (cdOffset + cdSize > eocd) throw damaged("its table of contents points outside the file");

  const entries: ZipEntry[] = [];
  let total = 0;
  let p = cdOffset;
  const cdEnd = cdOffset + cdSize;
  for (let i = 0; i < count; i++) {
    if (p + CENTRAL_BYTES > cdEnd || buf.readUInt32LE(p) !== SIG_CENTRAL) throw damaged("its table of contents is damaged");
    const flags = buf.readUInt16LE(p + 8);
    const method = buf.readUInt16LE(p + 10);
    const modified = buf.readUInt32LE(p + 12);
    const crc = buf.readUInt32LE(p + 16);
    const compressedSize = buf.readUInt32LE(p + 20);
    const size = buf.readUInt32LE(p + 24);
    const nameLength = buf.readUInt16LE(p + 28);
    const extraLength = buf.readUInt16LE(p + 30);
    const commentLength = buf.readUInt16LE(p + 32);
    const localOffset = buf.readUInt32LE(p + 42);
    const next = p + CENTRAL_BYTES + nameLength + extraLength + commentLength;
    if (next > cdEnd) throw damaged("its table of contents is damaged");
    const nameBytes = Buffer.from(buf.subarray(p + CENTRAL_BYTES, p + CENTRAL_BYTES + nameLength));
    const name = nameBytes.toString(flags & 0x800 ? "utf8" : "latin1");
    p = next;
    if (compressedSize === 0xffffffff || size === 0xffffffff || localOffset === 0xffffffff) throw zip64();
    if (flags & 0x41) {
      throw new UploadError(422, "password_protected", "This workbook is protected with a password. Remove the password in your spreadsheet program, save, and upload it again.");
    }
    if (method !== 0 && method !== 8) throw damaged(`part "${shown(name)}" uses a compression method other than deflate`);
    if (size > limits.maxEntryBytes) {
      throw new UploadError(
        413,
        "unpacks_too_large",
        `This workbook would unpack to far more data than a spreadsheet within the limits holds: part "${shown(name)}" declares ${mb(size)} when unpacked; at most ${mb(limits.maxEntryBytes)} per part is accepted. Remove unused sheets, images or rows and upload it again.`,
      );
    }
    total += size;

    // The local header must agree with the central directory (`xlsx` trusts the local one).
    if (localOffset + LOCAL_BYTES > cdOffset || buf.readUInt32LE(localOffset) !== SIG_LOCAL) throw damaged(`part "${shown(name)}" is not where the table of contents says`);
    const localFlags = buf.readUInt16LE(localOffset + 6);
    const localMethod = buf.readUInt16LE(localOffset + 8);
    const localCompressed = buf.readUInt32LE(localOffset + 18);
    const localSize = buf.readUInt32LE(localOffset + 22);
    const localNameLength = buf.readUInt16LE(localOffset + 26);
    const localExtraLength = buf.readUInt16LE(localOffset + 28);
    const dataStart = localOffset + LOCAL_BYTES + localNameLength + localExtraLength;
    if (localMethod !== method || !buf.subarray(localOffset + LOCAL_BYTES, localOffset + LOCAL_BYTES + localNameLength).equals(nameBytes)) {
      throw damaged(`part "${shown(name)}" does not match the table of contents`);
    }
    if (!(localFlags & 8) && (localCompressed !== compressedSize || localSize !== size)) throw sizeMismatch(name);
    if (method === 0 && compressedSize !== size) throw sizeMismatch(name);
    if (dataStart + compressedSize > cdOffset) throw damaged(`part "${shown(name)}" runs past the end of the data`);
    entries.push({ nameBytes, name, method: method as 0 | 8, flags, modified, crc, compressedSize, size, dataStart });
  }
  if (total > limits.maxTotalBytes) {
    throw new UploadError(
      413,
      "unpacks_too_large",
      `This workbook would unpack to ${mb(total)} in all; at most ${mb(limits.maxTotalBytes)} is accepted. Remove unused sheets, images or rows and upload it again.`,
    );
  }
  for (const e of entries) {
    if (e.size > limits.ratioFloorBytes && e.size / Math.max(1, e.compressedSize) > limits.maxRatio) {
      throw new UploadError(
        413,
        "compression_ratio",
        `Part "${shown(e.name)}" of this workbook is compressed ${Math.round(e.size / Math.max(1, e.compressedSize)).toLocaleString("en")} : 1 (${mb(e.compressedSize)} unpacking to ${mb(e.size)}); real spreadsheets stay under ${limits.maxRatio} : 1. Save the workbook again from your spreadsheet program and upload it.`,
      );
    }
  }
  return entries;
}

function sizeMismatch(name: string, detail = "its headers disagree about its size"): UploadError {
  return new UploadError(422, "size_mismatch", `Part "${shown(name)}" of this workbook is not what its headers say: ${detail}. The file is damaged or was made to mislead. ${AGAIN}`);
}

/**
 * Checks an .xlsx archive (see `readCentralDirectory`), inflates every entry
 * with its declared size as a hard limit and checks its CRC-32, and returns
 * the same archive with every entry stored uncompressed, in a buffer of its
 * own (so it can be transferred to a worker). At most
 * `limits.maxTotalBytes` plus headers are ever allocated for the result, and
 * one entry's inflated copy at a time besides.
 *
 * @example
 * ```ts
 * const stored = await unpackWorkbook(uploadBytes); // throws UploadError 413/422 on a bomb
 * ```
 */
export async function unpackWorkbook(bytes: Uint8Array, limits: ZipLimits = ZIP_LIMITS): Promise<Uint8Array> {
  const entries = readCentralDirectory(bytes, limits);
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let length = EOCD_BYTES;
  for (const e of entries) length += LOCAL_BYTES + CENTRAL_BYTES + 2 * e.nameBytes.length + e.size;
  const out = Buffer.from(new ArrayBuffer(length));
  const offsets: number[] = [];
  let w = 0;
  for (const e of entries) {
    const compressed = buf.subarray(e.dataStart, e.dataStart + e.compressedSize);
    let data: Buffer;
    if (e.method === 8) {
      try {
        data = await inflateRawAsync(compressed, { maxOutputLength: Math.max(1, e.size) });
      } catch (err) {
        if ((err as { code?: string }).code === "ERR_BUFFER_TOO_LARGE") throw sizeMismatch(e.name, `it unpacks to more than the ${e.size.toLocaleString("en")} bytes it declares`);
        throw damaged(`part "${shown(e.name)}" is damaged`);
      }
      if (data.length !== e.size) throw sizeMismatch(e.name, `it unpacks to ${data.length.toLocaleString("en")} bytes, not the ${e.size.toLocaleString("en")} it declares`);
    } else {
      data = compressed;
    }
    if (crc32(data) >>> 0 !== e.crc >>> 0) throw damaged(`part "${shown(e.name)}" fails its checksum`);
    offsets.push(w);
    w = out.writeUInt32LE(SIG_LOCAL, w);
    w = out.writeUInt16LE(20, w); // version needed: 2.0
    w = out.writeUInt16LE(e.flags & 0x800, w); // keep only "name is UTF-8"
    w = out.writeUInt16LE(0, w); // stored
    w = out.writeUInt32LE(e.modified, w);
    w = out.writeUInt32LE(e.crc, w);
    w = out.writeUInt32LE(e.size, w);
    w = out.writeUInt32LE(e.size, w);
    w = out.writeUInt16LE(e.nameBytes.length, w);
    w = out.writeUInt16LE(0, w);
    w += e.nameBytes.copy(out, w);
    w += data.copy(out, w);
  }
  const cdStart = w;
  entries.forEach((e, i) => {
    w = out.writeUInt32LE(SIG_CENTRAL, w);
    w = out.writeUInt16LE(20, w); // version made by
    w = out.writeUInt16LE(20, w); // version needed
    w = out.writeUInt16LE(e.flags & 0x800, w);
    w = out.writeUInt16LE(0, w);
    w = out.writeUInt32LE(e.modified, w);
    w = out.writeUInt32LE(e.crc, w);
    w = out.writeUInt32LE(e.size, w);
    w = out.writeUInt32LE(e.size, w);
    w = out.writeUInt16LE(e.nameBytes.length, w);
    w = out.writeUInt16LE(0, w); // extra
    w = out.writeUInt16LE(0, w); // comment
    w = out.writeUInt16LE(0, w); // disk
    w = out.writeUInt16LE(0, w); // internal attributes
    w = out.writeUInt32LE(0, w); // external attributes
    w = out.writeUInt32LE(offsets[i]!, w);
    w += e.nameBytes.copy(out, w);
  });
  const cdLength = w - cdStart;
  w = out.writeUInt32LE(SIG_EOCD, w);
  w = out.writeUInt16LE(0, w);
  w = out.writeUInt16LE(0, w);
  w = out.writeUInt16LE(entries.length, w);
  w = out.writeUInt16LE(entries.length, w);
  w = out.writeUInt32LE(cdLength, w);
  w = out.writeUInt32LE(cdStart, w);
  w = out.writeUInt16LE(0, w);
  if (w !== length) throw damaged("it could not be unpacked");
  return new Uint8Array(out.buffer, 0, length);
}
