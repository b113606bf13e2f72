import { getLot } from "@/db/queries/lots";
import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";

/** GET /api/lots/:id : the lot with every batch line that used it. */
export const GET = route<{ id: string }>({ permission: "lot:read" }, async (_req, { team, params }) => {
  const lot = await getLot(team.id, params.id);
  if (!lot) throw new NotFoundError("material lot");
  return Response.json(lot);
});
