import { getBatch, saveBatchNotes } from "@/db/queries/batches";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { batchNotesSchema } from "@/lib/validations/batches";

/** GET /api/batches/:id : the record with each line's deviation and the composition made. */
export const GET = route<{ id: string }>({ permission: "batch:read" }, async (_req, { team, params }) => {
  const batch = await getBatch(team.id, params.id);
  if (!batch) throw new NotFoundError("batch record");
  return Response.json(batch);
});

/** PATCH /api/batches/:id { notes } : notes of an open batch (409 once closed). */
export const PATCH = route<{ id: string }>({ permission: "batch:update" }, async (req, { actor, params }) => {
  const { notes } = await readJson(req, batchNotesSchema);
  return Response.json(await saveBatchNotes(actor, params.id, notes));
});
