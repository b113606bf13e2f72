import { startRevision } from "@/db/queries/formulations";
import { route } from "@/lib/api";
import { requireContext } from "@/lib/session";

/** Starts a new draft revision from the newest one. */
export const POST = route<{ id: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "formulation:update");
  const { id } = await params;
  return Response.json(await startRevision(ctx, id), { status: 201 });
});
