import { listMembers } from "@/db/queries/members";
import { route } from "@/lib/api";
import { requireContext } from "@/lib/session";

/** Members of the caller's team (any member may see who is in the team). */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers);
  return Response.json({ rows: await listMembers(ctx.teamId) });
});
