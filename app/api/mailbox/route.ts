import { listInvitations, listMembers } from "@/db/queries/members";
import { ApiError, route } from "@/lib/api";
import { readMailbox } from "@/lib/mailbox";
import { requireContext } from "@/lib/session";

/** Mails the fake SMTP server captured for this team's members and invitees (admins only). */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "mailbox:read");
  const [members, invites] = await Promise.all([listMembers(ctx.teamId), listInvitations(ctx.teamId)]);
  const visible = new Set([...members.map((m) => m.email.toLowerCase()), ...invites.map((i) => i.email.toLowerCase())]);
  const mails = await readMailbox(visible);
  if (mails === null) throw new ApiError(404, "not_found", "Mail goes to a real provider; there is no captured mailbox.");
  return Response.json({ rows: mails });
});
