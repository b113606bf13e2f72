import { startRevision } from "@/db/queries/revisions";
import { route } from "@/lib/http/route";

/** Starts a new draft revision from the newest one. */
export const POST = route<{ id: string }>({ permission: "formulation:update" }, async (_req, { actor, params }) => {
  return Response.json(await startRevision(actor, params.id), { status: 201 });
});
