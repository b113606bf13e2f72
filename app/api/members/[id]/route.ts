import { changeRole, removeMember } from "@/db/queries/members";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { changeRoleSchema } from "@/lib/validations/team";

/** Changes a member's role (409 for the team's last admin). */
export const PATCH = route<{ id: string }>({ permission: "member:update" }, async (req, { actor, params }) => {
  const { role } = await readJson(req, changeRoleSchema);
  return Response.json(await changeRole(actor.teamId, actor.userId, params.id, role));
});

/** Removes a member (409 for the team's last admin). */
export const DELETE = route<{ id: string }>({ permission: "member:delete" }, async (_req, { actor, params }) => {
  await removeMember(actor.teamId, actor.userId, params.id);
  return new Response(null, { status: 204 });
});
