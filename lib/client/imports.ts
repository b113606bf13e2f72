/**
 * The browser's way to spreadsheet imports: upload a file for a preview,
 * confirm or discard the preview, and the template to start from. The types
 * are the queries' and the parser's own (lib/spreadsheet), as JSON; the URLs
 * are written here only.
 */
import { uploadWithProgress, type UploadProgress } from "@/components/ui/upload-request";
import type { confirmImport as confirmImportQuery, createImportPreview } from "@/db/queries/imports";
import type { ImportKind } from "@/lib/enums";
import { apiSend } from "./fetcher";
import type { ApiData } from "./json";

/** The preview POST /api/imports answers with: problems by sheet, row and column, materials to link or create, counts. */
export type ImportPreview = ApiData<typeof createImportPreview>;
/** One problem of a preview, located as a person would look for it. */
export type ImportPreviewProblem = ImportPreview["problems"][number];
/** What the import will do with one material of the file. */
export type ImportProposal = ImportPreview["materials"][number];
/** The answer of POST /api/imports/:id/confirm. */
export type ImportConfirmation = ApiData<typeof confirmImportQuery>;

/** Every URL of the import API, and the templates an import starts from. */
export const importUrls = {
  upload: "/api/imports",
  one: (id: string) => `/api/imports/${encodeURIComponent(id)}`,
  confirm: (id: string) => `/api/imports/${encodeURIComponent(id)}/confirm`,
  template: (kind: ImportKind, format: "xlsx" | "csv") => `/api/templates/${kind}?format=${format}`,
};

/** Uploads a file to be read as `kind`, reporting progress; answers the preview (nothing is saved yet). */
export function uploadImport(kind: ImportKind, file: File, onProgress: (p: UploadProgress) => void): Promise<ImportPreview> {
  const form = new FormData();
  form.set("kind", kind);
  form.set("file", file);
  return uploadWithProgress<ImportPreview>(importUrls.upload, form, onProgress);
}

/** Saves a preview: 422 while errors remain or warnings are not accepted. */
export function confirmImport(id: string, acceptWarnings: boolean): Promise<ImportConfirmation> {
  return apiSend<ImportConfirmation>("POST", importUrls.confirm(id), { acceptWarnings });
}

/** Discards a preview that was not saved. */
export function discardImport(id: string): Promise<null> {
  return apiSend<null>("DELETE", importUrls.one(id));
}

/**
 * The formulation and revision a confirmed import created, if any. The
 * outcome column is typed loosely on the server (Record<string, unknown>),
 * so its two ids are read with a check rather than a cast.
 */
export function createdIds(confirmation: ImportConfirmation): { formulationId?: string; revisionId?: string } {
  const { formulationId, revisionId } = confirmation.outcome;
  return {
    formulationId: typeof formulationId === "string" ? formulationId : undefined,
    revisionId: typeof revisionId === "string" ? revisionId : undefined,
  };
}
