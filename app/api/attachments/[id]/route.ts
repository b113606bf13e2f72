import { attachmentLink, deleteAttachment, getAttachment } from "@/db/queries/attachments";
import { NotFoundError } from "@/lib/errors";
import { route, type MemberContext } from "@/lib/http/route";
import { ATTACHMENT_PERMISSIONS } from "@/lib/permissions";

/** The attachment the path names, in the caller's team (404 otherwise); its owner type picks the permission. */
async function storedAttachment(_req: Request, { team, params }: MemberContext<{ id: string }>) {
  const found = await getAttachment(team.id, params.id);
  if (!found) throw new NotFoundError("attachment");
  return { kind: found.ownerType, id: found.id };
}

/**
 * GET /api/attachments/:id : metadata with a signed download link valid for
 * a few minutes ({ …, url, expiresInSeconds }); with ?download=1 a 303
 * redirect to that link. Only the owning team, with read permission on the owner.
 */
export const GET = route({ permission: ATTACHMENT_PERMISSIONS.read, subject: storedAttachment }, async (req, { team, subject }) => {
  const link = await attachmentLink(team.id, subject.id);
  if (!link) throw new NotFoundError("attachment");
  if (new URL(req.url).searchParams.get("download") === "1") {
    return new Response(null, { status: 303, headers: { Location: link.url, "Cache-Control": "private, no-store" } });
  }
  return Response.json(link, { headers: { "Cache-Control": "private, no-store" } });
});

/** DELETE /api/attachments/:id : material:update (materials) or batch:update (open batch records only). */
export const DELETE = route({ permission: ATTACHMENT_PERMISSIONS.write, subject: storedAttachment }, async (_req, { actor, subject }) => {
  if (!(await deleteAttachment(actor, subject.id))) throw new NotFoundError("attachment");
  return new Response(null, { status: 204 });
});
