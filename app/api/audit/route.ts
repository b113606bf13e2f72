import { listAuditEvents } from "@/db/queries/audit";
import { readQuery } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { auditQuerySchema } from "@/lib/validations/team";

/** The team's audit trail, newest first, filterable by record, person, action and dates. */
export const GET = route({ permission: "audit:read" }, async (req, { team }) => {
  return Response.json(await listAuditEvents(team.id, readQuery(req, auditQuerySchema)));
});
