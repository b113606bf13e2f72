import { NotFoundError } from "@/lib/errors";
import { route } from "@/lib/http/route";
import { readMailbox } from "@/lib/mailbox";

/**
 * Mails the fake SMTP server captured about this team's own business
 * (invitations, review and release notices), for admins only. Mail about an
 * account (password reset, address confirmation) is never shown to a team.
 */
export const GET = route({ permission: "mailbox:read" }, async (_req, { team }) => {
  const mails = await readMailbox(team.id);
  if (mails === null) throw new NotFoundError("mailbox", "Mail goes to a real provider; there is no captured mailbox.");
  return Response.json({ rows: mails });
});
