import { listMembers } from "@/db/queries/members";
import { route } from "@/lib/http/route";

/** Members of the caller's team (any member may see who is in the team). */
export const GET = route({ access: "member" }, async (_req, { team }) => {
  return Response.json({ rows: await listMembers(team.id) });
});
