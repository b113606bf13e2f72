import { createMaterial, listMaterials } from "@/db/queries/materials";
import { readJson, readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { materialBodySchema, materialListQuerySchema } from "@/lib/validations/materials";

export const GET = route({ permission: "material:read" }, async (req, { team }) => {
  return Response.json(await listMaterials(team.id, readQuery(req, materialListQuerySchema)));
});

/** A new material; a name the library has is refused by the unique key (409 naming material.name), also when two people save at once. */
export const POST = route({ permission: "material:create" }, async (req, { actor }) => {
  const { material, casNumber } = await readJson(req, materialBodySchema);
  return Response.json(await createMaterial(actor.teamId, actor.userId, material, casNumber), { status: 201 });
});
