import { transition } from "@/db/queries/formulations";
import { notFound, readJson, route } from "@/lib/api";
import { notifyTransition } from "@/lib/notify";
import type { Permission } from "@/lib/permissions";
import { requireContext } from "@/lib/session";
import { reviewCommentSchema } from "@/lib/validations/api";
import type { WorkflowAction } from "@/lib/workflow";

const PERMISSION: Record<WorkflowAction, Permission> = {
  submit: "formulation:submit",
  approve: "formulation:review",
  return: "formulation:review",
  release: "formulation:release",
  archive: "formulation:archive",
};

/** POST /api/revisions/:id/(submit|approve|return|release|archive) with an optional { comment }. */
export const POST = route<{ id: string; action: string }>(async (req, { params }) => {
  const { id, action } = await params;
  if (!(action in PERMISSION)) {
    await requireContext(req.headers);
    throw notFound("action");
  }
  const ctx = await requireContext(req.headers, PERMISSION[action as WorkflowAction]);
  const { comment } = await readJson(req, reviewCommentSchema);
  const outcome = await transition(ctx, id, action as WorkflowAction, { comment });
  await notifyTransition(ctx.teamId, outcome, comment);
  return Response.json(outcome);
});
