import { deleteMaterial, getMaterial, updateMaterial } from "@/db/queries/materials";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { materialBodySchema } from "@/lib/validations/materials";

export const GET = route<{ id: string }>({ permission: "material:read" }, async (_req, { team, params }) => {
  const m = await getMaterial(team.id, params.id);
  if (!m) throw new NotFoundError("material");
  return Response.json(m);
});

/** Replaces a material (409 naming material.name when the library has the new name). */
export const PUT = route<{ id: string }>({ permission: "material:update" }, async (req, { actor, params }) => {
  const { material, casNumber } = await readJson(req, materialBodySchema);
  const updated = await updateMaterial(actor.teamId, actor.userId, params.id, material, casNumber);
  if (!updated) throw new NotFoundError("material");
  return Response.json(updated);
});

export const DELETE = route<{ id: string }>({ permission: "material:delete" }, async (_req, { actor, params }) => {
  if (!(await deleteMaterial(actor.teamId, actor.userId, params.id))) throw new NotFoundError("material");
  return new Response(null, { status: 204 });
});
