import { getBatch, saveBatchNotes } from "@/db/queries/batches";
import { notFound, readJson, route } from "@/lib/api";
import { batchNotesBodySchema } from "@/lib/validations/api";
import { requireContext } from "@/lib/session";

/** GET /api/batches/:id : the record with each line's deviation and the composition made. */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "batch:read");
  const { id } = await params;
  const batch = await getBatch(ctx.teamId, id);
  if (!batch) throw notFound("batch record");
  return Response.json(batch);
});

/** PATCH /api/batches/:id { notes } : notes of an open batch (409 once closed). */
export const PATCH = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "batch:update");
  const { id } = await params;
  const { notes } = await readJson(req, batchNotesBodySchema);
  return Response.json(await saveBatchNotes(ctx, id, notes));
});
