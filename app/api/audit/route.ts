import { listAuditEvents } from "@/db/queries/audit";
import { route } from "@/lib/api";
import { requireContext } from "@/lib/session";
import { auditQuerySchema, parseQuery } from "@/lib/validations/api";

/** The team's audit trail, newest first, filterable by record, person, action and dates. */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "audit:read");
  return Response.json(await listAuditEvents(ctx.teamId, parseQuery(req.url, auditQuerySchema)));
});
