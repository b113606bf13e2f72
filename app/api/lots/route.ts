import { listLots, receiveLot } from "@/db/queries/lots";
import { readJson, readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { lotListQuerySchema, receiveLotSchema } from "@/lib/validations/lots";

/** GET /api/lots?materialId=&inStock=1 : the team's lots, earliest expiry first. */
export const GET = route({ permission: "lot:read" }, async (req, { team }) => {
  const q = readQuery(req, lotListQuerySchema);
  return Response.json(await listLots(team.id, { materialId: q.materialId, inStock: q.inStock === "1" }));
});

/** POST /api/lots { materialId, supplier, supplierLot, quantity, unit, receivedOn, expiresOn?, measuredAssay?, notes? } : receives a lot (201). */
export const POST = route({ permission: "lot:receive" }, async (req, { actor }) => {
  const body = await readJson(req, receiveLotSchema);
  return Response.json(await receiveLot(actor, body), { status: 201 });
});
