/**
 * Turns an uploaded file into sheets of plain cells: checks size and type by
 * content (not by name), sends .xlsx to the worker thread and reads CSV with
 * our own parser. Every failure is an UploadError with a plain message.
 */
import { csvToSheets, CsvError } from "./csv";
import { IMPORT_LIMITS, type ImportLimits } from "./template";
import type { ParsedFile } from "./types";
import { UploadError } from "@/lib/uploads/upload-error";
import { readWorkbookInWorker } from "./worker";

export { UploadError };

const ZIP = [0x50, 0x4b, 0x03, 0x04];
const CFB = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];
/** Magic numbers of common non-spreadsheet files, for a clear refusal. */
const OTHER_BINARY: { bytes: number[]; what: string }[] = [
  { bytes: [0x25, 0x50, 0x44, 0x46], what: "a PDF document" },
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: "a PNG image" },
  { bytes: [0xff, 0xd8, 0xff], what: "a JPEG image" },
  { bytes: [0x47, 0x49, 0x46, 0x38], what: "a GIF image" },
  { bytes: [0x1f, 0x8b], what: "a gzip archive" },
  { bytes: [0x7f, 0x45, 0x4c, 0x46], what: "a program" },
  { bytes: [0x4d, 0x5a], what: "a program" },
];

function startsWith(bytes: Uint8Array, magic: readonly number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

/** UTF-16LE "EncryptionInfo": the stream a password-protected Office file carries. */
function looksEncrypted(bytes: Uint8Array): boolean {
  const needle = Buffer.from("EncryptionInfo", "utf16le");
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).includes(needle);
}

/** What the content of a file says it is. */
export function sniffFormat(bytes: Uint8Array): "xlsx" | "cfb" | "text" | { other: string } {
  if (startsWith(bytes, ZIP)) return "xlsx";
  if (startsWith(bytes, CFB)) return "cfb";
  for (const kind of OTHER_BINARY) if (startsWith(bytes, kind.bytes)) return { other: kind.what };
  const head = bytes.subarray(0, Math.min(bytes.length, 8192));
  if (head.includes(0)) return { other: "a binary file" };
  return "text";
}

/**
 * Reads an uploaded spreadsheet. `wanted` names the sheets to read;
 * `defaultSheet` is the sheet a plain CSV table (or, with
 * `firstSheetFallback`, the first workbook sheet) stands for.
 *
 * @example
 * ```ts
 * const parsed = await readUpload(bytes, "library.csv", { wanted: ["Materials", "Material sources"], defaultSheet: "Materials" });
 * ```
 */
export async function readUpload(
  bytes: Uint8Array,
  fileName: string,
  opts: { wanted: readonly string[]; defaultSheet: string; firstSheetFallback?: boolean; limits?: ImportLimits },
): Promise<ParsedFile> {
  const limits = opts.limits ?? IMPORT_LIMITS;
  if (bytes.byteLength === 0) throw new UploadError(400, "empty_file", "The file is empty.");
  if (bytes.byteLength > limits.maxBytes) {
    throw new UploadError(
      413,
      "too_large",
      `The file is ${(bytes.byteLength / 1024 / 1024).toFixed(1)} MB; files up to ${limits.maxBytes / 1024 / 1024} MB are accepted.`,
    );
  }
  const format = sniffFormat(bytes);
  const lowerName = fileName.toLowerCase();
  if (typeof format === "object") {
    throw new UploadError(415, "not_a_spreadsheet", `"${fileName}" is ${format.other}, not a spreadsheet. Upload an .xlsx workbook or a .csv file.`);
  }
  if (format === "cfb") {
    if (looksEncrypted(bytes)) {
      throw new UploadError(422, "password_protected", "This workbook is protected with a password. Remove the password in your spreadsheet program, save, and upload it again.");
    }
    throw new UploadError(415, "old_format", "This is an older binary workbook (.xls). Save it as .xlsx (or .csv) and upload it again.");
  }
  if (format === "xlsx") {
    const read = await readWorkbookInWorker(bytes, opts.wanted, { firstSheetFallback: opts.firstSheetFallback, limits });
    for (const sheet of read.sheets) {
      if (sheet.truncatedRows) {
        throw new UploadError(422, "too_many_rows", `Sheet "${sheet.name}" has more than ${limits.maxRows.toLocaleString("en")} rows; split it into smaller files.`);
      }
      if (sheet.truncatedColumns) {
        throw new UploadError(422, "too_many_columns", `Sheet "${sheet.name}" has more than ${limits.maxColumns} columns.`);
      }
      for (const row of sheet.rows) {
        if (row.some((cell) => typeof cell === "string" && cell.length > limits.maxCellChars)) {
          throw new UploadError(422, "cell_too_long", `Sheet "${sheet.name}": a cell holds more than ${limits.maxCellChars} characters.`);
        }
      }
    }
    return { format: "xlsx", sheetNames: read.sheetNames, sheets: read.sheets.map(({ name, rows }) => ({ name, rows })) };
  }
  if (lowerName.endsWith(".xlsx")) {
    throw new UploadError(415, "not_a_spreadsheet", `"${fileName}" is named .xlsx but is not an .xlsx workbook. Save it again from your spreadsheet program.`);
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new UploadError(422, "not_utf8", "This CSV file is not UTF-8 text. Save it as \"CSV UTF-8\" and upload it again.");
  }
  try {
    const sheets = csvToSheets(text, opts.defaultSheet, limits);
    return { format: "csv", sheetNames: sheets.map((s) => s.name), sheets };
  } catch (err) {
    if (err instanceof CsvError) throw new UploadError(422, "bad_csv", err.message);
    throw err;
  }
}
