import { createMaterial, listMaterials } from "@/db/queries/materials";
import { readJson, route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { materialBodySchema, materialListQuerySchema, parseQuery } from "@/lib/validations/api";

export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "material:read");
  return Response.json(await listMaterials(ctx.teamId, parseQuery(req.url, materialListQuerySchema)));
});

export const POST = route(async (req) => {
  const ctx = await requireContext(req.headers, "material:create");
  const { material, casNumber } = await readJson(req, materialBodySchema);
  // A name the team already has is refused by the unique key (409), also when two people save at once.
  return Response.json(await createMaterial(ctx.teamId, ctx.userId, material, casNumber), { status: 201 });
});
