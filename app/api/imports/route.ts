import { createImportPreview, loadLibrary, takenFormulationNames } from "@/db/queries/imports";
import { ApiError, route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { importKindSchema } from "@/lib/spreadsheet/api-schemas";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import { previewMaterialsImport } from "@/lib/spreadsheet/import-materials";
import { readUpload, UploadError } from "@/lib/spreadsheet/read";
import { FORMULATION_INPUT_SHEETS, IMPORT_LIMITS, MATERIALS_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import { readUploadedFile } from "@/lib/spreadsheet/upload";

/**
 * POST /api/imports (multipart: file, kind = "formulation" | "materials"; kind may also be given as ?kind=):
 * reads the file, checks every cell and answers 201 with the preview
 * { id, kind, problems[{ level, sheet, row, column, columnLetter, message }],
 * materials[{ action: "link" | "create", … }], counts, … }. Nothing is saved
 * until POST /api/imports/:id/confirm.
 */
export const POST = route(async (req) => {
  const kindText = new URL(req.url).searchParams.get("kind");
  // Who may import depends on the kind: from ?kind= it is checked before the body is read; from the form, right after.
  const early = kindText ? importKindSchema.safeParse(kindText) : null;
  if (early?.success) await requireContext(req.headers, early.data === "formulation" ? "formulation:create" : "material:create");
  else await requireContext(req.headers);
  const upload = await readUploadedFile(req, IMPORT_LIMITS.maxBytes);
  const parsedKind = importKindSchema.safeParse(upload.fields.kind ?? kindText);
  if (!parsedKind.success) throw new ApiError(422, "invalid_input", parsedKind.error.issues[0]!.message, { kind: parsedKind.error.issues[0]!.message });
  const kind = parsedKind.data;
  const ctx = await requireContext(req.headers, kind === "formulation" ? "formulation:create" : "material:create");
  let parsed;
  try {
    parsed =
      kind === "formulation"
        ? await readUpload(upload.bytes, upload.fileName, { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input })
        : await readUpload(upload.bytes, upload.fileName, { wanted: MATERIALS_INPUT_SHEETS, defaultSheet: SHEET.materials, firstSheetFallback: true });
  } catch (err) {
    if (err instanceof UploadError) throw new ApiError(err.status, err.code, err.message, { file: err.message });
    throw err;
  }
  const library = await loadLibrary(ctx.teamId);
  const newId = () => crypto.randomUUID();
  const preview =
    kind === "formulation"
      ? previewFormulationImport(parsed.sheets, library, await takenFormulationNames(ctx.teamId), newId)
      : previewMaterialsImport(parsed.sheets, library, newId);
  const saved = await createImportPreview(ctx, kind, upload.fileName, preview);
  return Response.json({ ...saved, format: parsed.format, sheetNames: parsed.sheetNames }, { status: 201 });
});
