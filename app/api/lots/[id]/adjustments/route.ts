import { adjustLot, listLotAdjustments } from "@/db/queries/lot-adjustments";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { adjustLotSchema } from "@/lib/validations/lot-adjustments";

/** GET /api/lots/:id/adjustments : the lot's stock adjustments, newest first, with the lot's unit. */
export const GET = route<{ id: string }>({ permission: "lot:read" }, async (_req, { team, params }) => {
  const list = await listLotAdjustments(team.id, params.id);
  if (!list) throw new NotFoundError("material lot");
  return Response.json(list);
});

/**
 * POST /api/lots/:id/adjustments { version, quantityOnHand, reason, note? } : sets the lot's
 * quantity on hand to what was counted (in the lot's unit), for a reason (a note is required
 * for "other"); 201 with the lot and the adjustment. 409 on a stale version, 422 when the
 * amount is already on hand or above 10 × the quantity received. The body is held to the
 * JSON limit of every lot route.
 */
export const POST = route<{ id: string }>({ permission: "lot:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, adjustLotSchema);
  return Response.json(await adjustLot(actor, params.id, body), { status: 201 });
});
