import { z } from "zod";
import { confirmImport, getImportPreview } from "@/db/queries/imports";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route, type MemberContext } from "@/lib/http/route";
import { IMPORT_PERMISSIONS } from "@/lib/permissions";

const bodySchema = z.strictObject({ acceptWarnings: z.boolean().optional() });

/** The caller's own preview the path names (404 otherwise); its kind picks the permission. */
async function ownPreview(_req: Request, { actor, params }: MemberContext<{ id: string }>) {
  const preview = await getImportPreview(actor, params.id);
  if (!preview) throw new NotFoundError("import");
  return { kind: preview.kind, id: preview.id };
}

/**
 * POST /api/imports/:id/confirm { acceptWarnings?: boolean } : saves the
 * import in one transaction. 422 while any error remains (or warnings are
 * not accepted), 409 when already saved or a name was taken meanwhile.
 */
export const POST = route({ permission: IMPORT_PERMISSIONS, subject: ownPreview }, async (req, { actor, subject }) => {
  const { acceptWarnings } = await readJson(req, bodySchema);
  return Response.json(await confirmImport(actor, subject.id, { acceptWarnings: acceptWarnings === true }));
});
