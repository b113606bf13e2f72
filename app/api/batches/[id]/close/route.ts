import { closeBatch } from "@/db/queries/batches";
import { route } from "@/lib/http/route";

/** POST /api/batches/:id/close : closes the record (422 with the missing lines; 409 when already closed). */
export const POST = route<{ id: string }>({ permission: "batch:update" }, async (_req, { actor, params }) => {
  return Response.json(await closeBatch(actor, params.id));
});
