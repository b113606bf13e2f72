import { startRevision } from "@/db/queries/revisions";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { startRevisionSchema } from "@/lib/validations/explorations";

/**
 * Starts a new draft revision: from the newest one (no body, or `{}`), or with
 * the input given (`{ input, fromExploration? }`: a candidate of the design
 * explorer), computed by the full engine. 409 while a draft or review is open.
 */
export const POST = route<{ id: string }>({ permission: "formulation:update" }, async (req, { actor, params }) => {
  const body = await readJson(req, startRevisionSchema);
  const from = body.input ? { input: body.input, fromExploration: body.fromExploration } : undefined;
  return Response.json(await startRevision(actor, params.id, from), { status: 201 });
});
