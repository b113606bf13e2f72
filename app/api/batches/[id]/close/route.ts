import { closeBatch } from "@/db/queries/batches";
import { route } from "@/lib/api";
import { requireContext } from "@/lib/session";

/** POST /api/batches/:id/close : closes the record (422 with the missing lines; 409 when already closed). */
export const POST = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "batch:update");
  const { id } = await params;
  return Response.json(await closeBatch(ctx, id));
});
