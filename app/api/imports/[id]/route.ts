import { discardImportPreview, getImportPreview } from "@/db/queries/imports";
import { notFound, route } from "@/lib/api";
import { requireContext } from "@/lib/session";

/** GET /api/imports/:id : the stored preview (own imports only). */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers);
  const { id } = await params;
  const preview = await getImportPreview(ctx, id);
  if (!preview) throw notFound("import");
  return Response.json(preview);
});

/** DELETE /api/imports/:id : discards a preview that was not saved. */
export const DELETE = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers);
  const { id } = await params;
  if (!(await discardImportPreview(ctx, id))) throw notFound("import");
  return new Response(null, { status: 204 });
});
