import type { ImportKind } from "@/lib/enums";
import { IMPORT_LIMITS } from "@/lib/spreadsheet/template";
import { fmtBytes } from "@/components/ui/upload-request";

/** What each kind of import is called where the user picks one. */
export const IMPORT_KIND_LABELS: Record<ImportKind, string> = { formulation: "A formulation", materials: "Materials for the library" };

/** What a file of each kind holds and what saving it does. */
export const IMPORT_KIND_HELP: Record<ImportKind, string> = {
  formulation:
    "One formulation per file: its settings, components, process steps and the materials it uses. It is saved as a new formulation with a draft revision.",
  materials:
    "Any number of materials as supplied, with the source of each value. Materials already in the library are linked, not changed; the others are added.",
};

/** The limits of an upload in words, from the limits the server applies (lib/spreadsheet/template.ts). */
export const UPLOAD_LIMIT_WORDS = `up to ${IMPORT_LIMITS.maxBytes / 1024 / 1024} MB, ${IMPORT_LIMITS.maxRows.toLocaleString("en")} rows per sheet, ${IMPORT_LIMITS.maxSheets} sheets`;

/** Why a chosen file will not be read, before it is sent; null when it may be. */
export function fileProblem(file: File): string | null {
  if (!/\.(xlsx|csv)$/i.test(file.name)) return `“${file.name}” is not a workbook (.xlsx) or a CSV file.`;
  if (file.size > IMPORT_LIMITS.maxBytes) return `“${file.name}” is ${fmtBytes(file.size)}; at most ${IMPORT_LIMITS.maxBytes / 1024 / 1024} MB is read.`;
  return null;
}
