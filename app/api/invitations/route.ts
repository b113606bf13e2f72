import { recordEvent } from "@/db/queries/audit";
import { listInvitations } from "@/db/queries/members";
import { db } from "@/db";
import { readJson, route } from "@/lib/api";
import { auth } from "@/lib/auth";
import { fromAuthError } from "@/lib/auth-errors";
import { requireContext } from "@/lib/session";
import { inviteSchema } from "@/lib/validations/api";

export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "invitation:create");
  return Response.json({ rows: await listInvitations(ctx.teamId) });
});

/** Invites someone by e-mail with a role; the mail carries a link valid for 7 days. */
export const POST = route(async (req) => {
  const ctx = await requireContext(req.headers, "invitation:create");
  const { email, role } = await readJson(req, inviteSchema);
  let created: { id: string } | null;
  try {
    created = (await auth.api.createInvitation({
      headers: req.headers,
      body: { email, role: role as "admin", organizationId: ctx.teamId, resend: true },
    })) as { id: string } | null;
  } catch (err) {
    throw fromAuthError(err);
  }
  if (created) {
    await recordEvent(db, {
      teamId: ctx.teamId,
      actorId: ctx.userId,
      action: "member.invited",
      entityType: "invitation",
      entityId: created.id,
      summary: { after: { email, role } },
    });
  }
  return Response.json(created, { status: 201 });
});
