import { discardImportPreview, getImportPreview } from "@/db/queries/imports";
import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";

/** GET /api/imports/:id : the stored preview (own imports only). */
export const GET = route<{ id: string }>({ access: "member" }, async (_req, { actor, params }) => {
  const preview = await getImportPreview(actor, params.id);
  if (!preview) throw new NotFoundError("import");
  return Response.json(preview);
});

/** DELETE /api/imports/:id : discards a preview that was not saved. */
export const DELETE = route<{ id: string }>({ access: "member" }, async (_req, { actor, params }) => {
  if (!(await discardImportPreview(actor, params.id))) throw new NotFoundError("import");
  return new Response(null, { status: 204 });
});
