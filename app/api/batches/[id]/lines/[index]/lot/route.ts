import { chooseLot } from "@/db/queries/lots";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { chooseLotSchema } from "@/lib/validations/lots";

/** PUT /api/batches/:id/lines/:index/lot { lotId | null } : the line takes from that lot (422 expired, used up or short; 409 closed). */
export const PUT = route<{ id: string; index: string }>({ permission: "batch:update" }, async (req, { actor, params }) => {
  const n = Number(params.index);
  if (!Number.isInteger(n) || n < 0 || n > 10_000) throw new NotFoundError("line");
  const { lotId } = await readJson(req, chooseLotSchema);
  return Response.json(await chooseLot(actor, params.id, n, lotId));
});
