import { deleteMaterial, getMaterial, updateMaterial } from "@/db/queries/materials";
import { notFound, readJson, route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { materialBodySchema } from "@/lib/validations/api";

export const GET = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "material:read");
  const m = await getMaterial(ctx.teamId, (await params).id);
  if (!m) throw notFound("material");
  return Response.json(m);
});

export const PUT = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "material:update");
  const { id } = await params;
  if (!(await getMaterial(ctx.teamId, id))) throw notFound("material");
  const { material, casNumber } = await readJson(req, materialBodySchema);
  const updated = await updateMaterial(ctx.teamId, ctx.userId, id, material, casNumber);
  if (!updated) throw notFound("material");
  return Response.json(updated);
});

export const DELETE = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "material:delete");
  if (!(await deleteMaterial(ctx.teamId, ctx.userId, (await params).id))) throw notFound("material");
  return new Response(null, { status: 204 });
});
