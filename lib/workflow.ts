/**
 * The life of a formulation revision and the rules of each step. Pure
 * functions: db/queries/formulations.ts applies them inside one transaction.
 *
 *   draft → in_review → approved → released → archived
 *             └─ returned (back to draft, with a comment)
 */
import type { FormulationResult } from "@/lib/formulation";
import { REVISION_STATES } from "./enums";
import { ConflictError, RuleError } from "./errors";

export type RevisionState = (typeof REVISION_STATES)[number];
export type WorkflowAction = "submit" | "approve" | "return" | "release" | "archive";

/** Plain words shown to people for each state. */
export const STATE_LABELS: Record<RevisionState, string> = {
  draft: "Draft",
  in_review: "Waiting for review",
  approved: "Approved",
  released: "Released to production",
  archived: "Archived",
};

const FROM: Record<WorkflowAction, RevisionState[]> = {
  submit: ["draft"],
  approve: ["in_review"],
  return: ["in_review"],
  release: ["approved"],
  archive: ["draft", "approved", "released"],
};

const TO: Record<WorkflowAction, RevisionState> = {
  submit: "in_review",
  approve: "approved",
  return: "draft",
  release: "released",
  archive: "archived",
};

/** A review or submission rule that the request broke (a RuleError: 422). */
export class WorkflowError extends RuleError {
  declare readonly code: "has_errors" | "own_revision" | "thermal_fail" | "comment_required";

  constructor(code: WorkflowError["code"], message: string, field?: string) {
    super(code, message, field);
    this.name = "WorkflowError";
  }
}

/**
 * The state after `action`; a ConflictError with code "wrong_state" (409)
 * when `action` is not possible from `state`.
 */
export function nextState(state: RevisionState, action: WorkflowAction): RevisionState {
  if (!FROM[action].includes(state)) {
    throw new ConflictError(
      "wrong_state",
      `This revision is ${STATE_LABELS[state].toLowerCase()}; it cannot be ${ACTION_PAST[action]} now.`,
    );
  }
  return TO[action];
}

const ACTION_PAST: Record<WorkflowAction, string> = {
  submit: "submitted for review",
  approve: "approved",
  return: "returned",
  release: "released",
  archive: "archived",
};

/**
 * Notices that do not block submitting: a thermal fail is the reviewer's to
 * see and refuse (it can never be approved), so the author can still ask.
 */
const REVIEWER_DECIDES = new Set(["thermal_limit_exceeded"]);

/** Submitting needs a computed result with no error notices (a thermal fail goes to the reviewer). */
export function assertSubmittable(result: FormulationResult | null, computeError: string | null): void {
  if (!result || computeError) {
    throw new WorkflowError("has_errors", `The recipe cannot be computed: ${computeError ?? "no result"}. Fix it before submitting.`);
  }
  const errors = result.notices.filter((n) => n.level === "error" && !REVIEWER_DECIDES.has(n.code));
  if (errors.length > 0) {
    throw new WorkflowError("has_errors", `Fix ${errors.length} error notice(s) before submitting: ${errors[0]!.message}`);
  }
}

/**
 * A reviewer's decision: never by anyone who authored the revision (its
 * creator, and everyone who saved or submitted it, `authorIds`); a thermal
 * fail cannot be approved; a thermal caution or a return needs a comment.
 */
export function assertReviewable(input: {
  decision: "approved" | "returned";
  reviewerId: string;
  authorIds: readonly string[];
  comment: string | null | undefined;
  thermalStatus: "clear" | "caution" | "fail" | undefined;
}): void {
  const comment = input.comment?.trim() ?? "";
  if (input.authorIds.includes(input.reviewerId)) {
    throw new WorkflowError("own_revision", "You wrote or changed this revision; another reviewer must decide on it.");
  }
  if (input.decision === "returned" && !comment) {
    throw new WorkflowError("comment_required", "Say what needs changing: a comment is required to send a revision back.", "comment");
  }
  if (input.decision === "approved" && input.thermalStatus === "fail") {
    throw new WorkflowError(
      "thermal_fail",
      "A process step exceeds a material's temperature limit (thermal check: fails). It cannot be approved; send it back.",
    );
  }
  if (input.decision === "approved" && input.thermalStatus === "caution" && !comment) {
    throw new WorkflowError(
      "comment_required",
      "The thermal check needs caution: add a comment saying why the schedule is acceptable.",
      "comment",
    );
  }
}
