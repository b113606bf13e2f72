import { z } from "zod";
import { createImportPreview, loadLibrary, takenFormulationNames } from "@/db/queries/imports";
import type { ImportKind } from "@/lib/enums";
import { route } from "@/lib/http/route";
import { IMPORT_PERMISSIONS } from "@/lib/permissions";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport } from "@/lib/spreadsheet/import-materials";
import { readUpload } from "@/lib/spreadsheet/read";
import { FORMULATION_INPUT_SHEETS, IMPORT_LIMITS, MATERIALS_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import { readUploadedFile, type UploadedFile } from "@/lib/uploads/multipart";
import { importKindSchema } from "@/lib/validations/uploads";

/**
 * The kind of an import: from ?kind= when given, so that who may import is
 * known before the body is read; otherwise from the form, read here.
 */
async function importKind(req: Request): Promise<{ kind: ImportKind; upload: UploadedFile | null }> {
  const fromQuery = importKindSchema.safeParse(new URL(req.url).searchParams.get("kind"));
  if (fromQuery.success) return { kind: fromQuery.data, upload: null };
  const upload = await readUploadedFile(req, IMPORT_LIMITS.maxBytes);
  return { kind: z.object({ kind: importKindSchema }).parse(upload.fields).kind, upload };
}

/**
 * POST /api/imports (multipart: file, kind = "formulation" | "materials"; kind may also be given as ?kind=):
 * reads the file, checks every cell and answers 201 with the preview
 * { id, kind, problems[{ level, sheet, row, column, columnLetter, message }],
 * materials[{ action: "link" | "create", … }], counts, … }. Nothing is saved
 * until POST /api/imports/:id/confirm.
 */
export const POST = route({ permission: IMPORT_PERMISSIONS, subject: importKind }, async (req, { actor, subject }) => {
  const { kind } = subject;
  const upload = subject.upload ?? (await readUploadedFile(req, IMPORT_LIMITS.maxBytes));
  const parsed =
    kind === "formulation"
      ? await readUpload(upload.bytes, upload.fileName, { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input })
      : await readUpload(upload.bytes, upload.fileName, { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials, firstSheetFallback: true });
  const library = await loadLibrary(actor.teamId);
  const newId = () => crypto.randomUUID();
  const preview =
    kind === "formulation"
      ? previewFormulationImport(parsed.sheets, library, await takenFormulationNames(actor.teamId), newId)
      : previewMaterialsImport(parsed.sheets, library, newId);
  const saved = await createImportPreview(actor, kind, upload.fileName, preview);
  return Response.json({ ...saved, format: parsed.format, sheetNames: parsed.sheetNames }, { status: 201 });
});
