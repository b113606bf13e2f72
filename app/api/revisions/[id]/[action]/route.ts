import { transition } from "@/db/queries/revisions";
import { readJson } from "@/lib/http/body";
import { byParam, route } from "@/lib/http/route";
import { notifyTransition } from "@/lib/notify";
import { REVISION_ACTION_PERMISSIONS } from "@/lib/permissions";
import { reviewCommentSchema } from "@/lib/validations/formulations";
import type { WorkflowAction } from "@/lib/workflow";

/**
 * POST /api/revisions/:id/(submit|approve|return|release|archive) with an
 * optional { comment }. The permission is the action's
 * (REVISION_ACTION_PERMISSIONS); another action is 404.
 */
export const POST = route<{ id: string; action: string }, { kind: WorkflowAction }>(
  { permission: REVISION_ACTION_PERMISSIONS, subject: byParam<WorkflowAction>("action") },
  async (req, { actor, params, subject }) => {
    const { comment } = await readJson(req, reviewCommentSchema);
    const outcome = await transition(actor, params.id, subject.kind, { comment });
    await notifyTransition(actor.teamId, outcome, comment);
    return Response.json(outcome);
  },
);
