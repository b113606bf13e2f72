/** Plain-word descriptions of audit events, shared by the home page, activity and history. */
import type { AuditEvent } from "@/lib/client/audit";
import type { AuditAction } from "@/lib/enums";
import { ADJUSTMENT_REASON_LABELS } from "@/lib/labels";

/** An audit event as a server page reads it (dates as Date) or as the API sends it (dates as text). */
export type AuditEventView = Omit<AuditEvent, "createdAt"> & { createdAt: string | Date };

/** Words for every action of the audit trail: a new action without words fails type-checking. */
export const ACTION_LABELS: Record<AuditAction, string> = {
  "formulation.created": "created the formulation",
  "revision.saved": "saved a draft",
  "revision.seeded": "recorded the revision (demo data)",
  "revision.started": "started a new revision",
  "revision.submitted": "submitted for review",
  "revision.approved": "approved",
  "revision.returned": "sent back with comments",
  "revision.released": "released to production",
  "revision.archived": "archived",
  "material.created": "added a material",
  "material.updated": "changed a material",
  "material.deleted": "removed a material",
  "member.role_changed": "changed a member's role",
  "member.removed": "removed a member",
  "member.invited": "invited someone",
  "member.joined": "joined the team by invitation",
  "batch.started": "started a batch",
  "batch.line_recorded": "recorded a weighing",
  "batch.notes_changed": "changed a batch's notes",
  "batch.closed": "closed a batch",
  "batch.settings_changed": "changed the batch tolerance settings",
  "team.currency_changed": "changed the team's currency",
  "attachment.added": "added a document",
  "attachment.removed": "removed a document",
  "lot.received": "received a material lot",
  "lot.updated": "changed a material lot",
  "lot.adjusted": "adjusted a lot's stock on hand",
  "batch.lot_chosen": "chose a lot for a batch line",
  "batch.result_entered": "entered a test result",
  "batch.result_acknowledged": "acknowledged an out-of-specification result",
  "batch.disposed": "decided a batch's disposition",
  "revision.specifications_changed": "changed the test specifications",
  "exploration.saved": "saved a design exploration",
  "exploration.deleted": "deleted a design exploration",
};

/** A value of a before/after pair in words: empty text and null read "none". */
function shown(value: unknown): string {
  if (value === null || value === undefined || value === "") return "none";
  if (typeof value === "number") return String(value);
  const text = String(value);
  return text.length > 80 ? `${text.slice(0, 79)}…` : `“${text}”`;
}

/** "approved", "saved a draft" … (unknown actions: the code with dots as spaces). */
export function actionWords(action: string): string {
  return (ACTION_LABELS as Record<string, string>)[action] ?? action.replace(/[._]/g, " ");
}

type Summary = { before?: Record<string, unknown>; after?: Record<string, unknown>; note?: string } | null;

/** A short detail line from an event's summary (name, revision, role, comment …). */
export function summaryWords(summary: unknown): string {
  const s = (summary ?? null) as Summary;
  if (!s || typeof s !== "object") return "";
  const parts: string[] = [];
  const after = s.after ?? {};
  const before = s.before ?? {};
  if (typeof after.name === "string") parts.push(String(after.name));
  else if (typeof before.name === "string") parts.push(String(before.name));
  if (typeof after.revision === "number") parts.push(`revision ${after.revision}`);
  if (typeof before.role === "string" && typeof after.role === "string") parts.push(`${before.role} → ${after.role}`);
  else if (typeof after.role === "string") parts.push(`as ${after.role}`);
  if (typeof after.email === "string") parts.push(String(after.email));
  if (typeof after.version === "number") parts.push(`version ${after.version}`);
  if (typeof after.computeError === "string" && after.computeError) parts.push(`cannot compute: ${after.computeError}`);
  if (typeof after.line === "number") parts.push(`line ${after.line}`);
  for (const [key, label] of [
    ["notes", "notes"],
    ["initials", "initials"],
    ["lotNumber", "lot"],
    ["actualGrams", "mass (g)"],
  ] as const) {
    if (key in after && before[key] !== after[key]) parts.push(`${label} ${shown(before[key])} → ${shown(after[key])}`);
  }
  if (typeof after.quantityOnHand === "number") {
    const unit = typeof after.unit === "string" ? ` ${after.unit}` : "";
    parts.push(`on hand ${shown(before.quantityOnHand)}${unit} → ${after.quantityOnHand}${unit}`);
  }
  if (typeof after.reason === "string") parts.push((ADJUSTMENT_REASON_LABELS as Record<string, string>)[after.reason] ?? after.reason);
  if (typeof s.note === "string" && s.note) parts.push(`“${s.note}”`);
  return parts.join(" · ");
}

/** Where an event's record lives in the app, if it has a page. */
export function eventHref(e: Pick<AuditEventView, "entityType" | "entityId">): string | null {
  if (e.entityType === "revision") return `/revisions/${e.entityId}`;
  if (e.entityType === "formulation") return `/formulations/${e.entityId}`;
  if (e.entityType === "material") return `/materials/${e.entityId}`;
  if (e.entityType === "batch") return `/batches/${e.entityId}`;
  return null;
}
