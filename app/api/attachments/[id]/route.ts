import { attachmentLink, deleteAttachment, getAttachment } from "@/db/queries/attachments";
import { notFound, route } from "@/lib/api";
import type { Permission } from "@/lib/permissions";
import { requireContext } from "@/lib/session";

const READ: Record<string, Permission> = { material: "material:read", batch: "batch:read" };
const WRITE: Record<string, Permission> = { material: "material:update", batch: "batch:update" };

/**
 * GET /api/attachments/:id : metadata with a signed download link valid for
 * a few minutes ({ …, url, expiresInSeconds }); with ?download=1 a 303
 * redirect to that link. Only the owning team, with read permission on the owner.
 */
export const GET = route<{ id: string }>(async (req, { params }) => {
  const signedIn = await requireContext(req.headers);
  const { id } = await params;
  const found = await getAttachment(signedIn.teamId, id);
  if (!found) throw notFound("attachment");
  const ctx = await requireContext(req.headers, READ[found.ownerType] ?? "material:read");
  const link = await attachmentLink(ctx.teamId, id);
  if (!link) throw notFound("attachment");
  if (new URL(req.url).searchParams.get("download") === "1") {
    return new Response(null, { status: 303, headers: { Location: link.url, "Cache-Control": "private, no-store" } });
  }
  return Response.json(link, { headers: { "Cache-Control": "private, no-store" } });
});

/** DELETE /api/attachments/:id : material:update (materials) or batch:update (open batch records only). */
export const DELETE = route<{ id: string }>(async (req, { params }) => {
  const signedIn = await requireContext(req.headers);
  const { id } = await params;
  const found = await getAttachment(signedIn.teamId, id);
  if (!found) throw notFound("attachment");
  const ctx = await requireContext(req.headers, WRITE[found.ownerType] ?? "material:update");
  if (!(await deleteAttachment(ctx, id))) throw notFound("attachment");
  return new Response(null, { status: 204 });
});
