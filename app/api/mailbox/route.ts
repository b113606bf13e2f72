import { ApiError, route } from "@/lib/api";
import { readMailbox } from "@/lib/mailbox";
import { requireContext } from "@/lib/session";

/**
 * Mails the fake SMTP server captured about this team's own business
 * (invitations, review and release notices), for admins only. Mail about an
 * account (password reset, address confirmation) is never shown to a team.
 */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "mailbox:read");
  const mails = await readMailbox(ctx.teamId);
  if (mails === null) throw new ApiError(404, "not_found", "Mail goes to a real provider; there is no captured mailbox.");
  return Response.json({ rows: mails });
});
