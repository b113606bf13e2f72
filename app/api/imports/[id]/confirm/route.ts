import { z } from "zod";
import { confirmImport, getImportPreview } from "@/db/queries/imports";
import { notFound, readJson, route } from "@/lib/api";
import { requireContext } from "@/lib/session";

const bodySchema = z.strictObject({ acceptWarnings: z.boolean().optional() });

/**
 * POST /api/imports/:id/confirm { acceptWarnings?: boolean } : saves the
 * import in one transaction. 422 while any error remains (or warnings are
 * not accepted), 409 when already saved or a name was taken meanwhile.
 */
export const POST = route<{ id: string }>(async (req, { params }) => {
  const signedIn = await requireContext(req.headers);
  const { id } = await params;
  const preview = await getImportPreview(signedIn, id);
  if (!preview) throw notFound("import");
  const ctx = await requireContext(req.headers, preview.kind === "formulation" ? "formulation:create" : "material:create");
  const { acceptWarnings } = await readJson(req, bodySchema);
  return Response.json(await confirmImport(ctx, id, { acceptWarnings: acceptWarnings === true }));
});
