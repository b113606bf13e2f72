import { correctLot, getLot } from "@/db/queries/lots";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { correctLotSchema } from "@/lib/validations/lots";

/** GET /api/lots/:id : the lot with every batch line that used it. */
export const GET = route<{ id: string }>({ permission: "lot:read" }, async (_req, { team, params }) => {
  const lot = await getLot(team.id, params.id);
  if (!lot) throw new NotFoundError("material lot");
  return Response.json(lot);
});

/**
 * PATCH /api/lots/:id { version, supplier?, supplierLot?, expiresOn?, measuredAssay?, notes? } :
 * corrects a received lot (at least one field; null clears the expiry date, the assay or the
 * notes). Quantities are not here: they change only through releases. 409 on a stale version
 * or a supplier lot number the material already has.
 */
export const PATCH = route<{ id: string }>({ permission: "lot:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, correctLotSchema);
  return Response.json(await correctLot(actor, params.id, body));
});
