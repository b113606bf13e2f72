import { closeBatch } from "@/db/queries/batches";
import { route } from "@/lib/http/route";
import { notifyAwaitingDisposition } from "@/lib/notify-batches";

/** POST /api/batches/:id/close : closes the record (422 with the missing lines; 409 when already closed); mails the reviewers that it waits for disposition. */
export const POST = route<{ id: string }>({ permission: "batch:update" }, async (_req, { actor, team, params }) => {
  const batch = await closeBatch(actor, params.id);
  await notifyAwaitingDisposition(team.id, batch);
  return Response.json(batch);
});
