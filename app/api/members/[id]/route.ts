import { changeRole, removeMember } from "@/db/queries/members";
import { readJson, route } from "@/lib/api";
import type { RoleName } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { changeRoleSchema } from "@/lib/validations/api";

export const PATCH = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "member:update");
  const { role } = await readJson(req, changeRoleSchema);
  return Response.json(await changeRole(ctx.teamId, ctx.userId, (await params).id, role as RoleName));
});

export const DELETE = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "member:delete");
  await removeMember(ctx.teamId, ctx.userId, (await params).id);
  return new Response(null, { status: 204 });
});
