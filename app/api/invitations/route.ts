import { listInvitations } from "@/db/queries/members";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { inviteMember } from "@/lib/teams";
import { inviteSchema } from "@/lib/validations/team";

/** The team's invitations, oldest first. */
export const GET = route({ permission: "invitation:create" }, async (_req, { team }) => {
  return Response.json({ rows: await listInvitations(team.id) });
});

/** Invites someone by e-mail with a role; the mail carries a link valid for 7 days. */
export const POST = route({ permission: "invitation:create" }, async (req, { actor }) => {
  const { email, role } = await readJson(req, inviteSchema);
  return Response.json(await inviteMember(req.headers, actor, email, role), { status: 201 });
});
