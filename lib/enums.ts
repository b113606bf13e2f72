/**
 * The one definition of each set of states and kinds that the database, the
 * API and the pages share. The database enums (db/schema), the zod schemas
 * (lib/validations) and the label maps on the pages all derive from these
 * lists; nothing restates them. Framework-free, so the schema, the server and
 * the browser can import it.
 */

/** Kinds of material in a team's library; defined by the engine, which imports nothing from outside itself. */
export { MATERIAL_KINDS, type MaterialKind } from "./formulation/kinds";

/** Revision states, in the order a revision normally moves through them. */
export const REVISION_STATES = ["draft", "in_review", "approved", "released", "archived"] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

/** A reviewer's decision on a submitted revision. */
export const REVIEW_DECISIONS = ["approved", "returned"] as const;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

/** A batch record is open while production weighs, closed once signed off. */
export const BATCH_STATES = ["open", "closed"] as const;
export type BatchState = (typeof BATCH_STATES)[number];

/** How a closed batch ends: released for use, rejected, or released under deviation with a written justification. */
export const BATCH_DISPOSITIONS = ["released", "rejected", "released_under_deviation"] as const;
export type BatchDisposition = (typeof BATCH_DISPOSITIONS)[number];

/** Units a material lot is counted in (mass or volume as supplied). */
export const LOT_UNITS = ["g", "kg", "mL", "L"] as const;
export type LotUnit = (typeof LOT_UNITS)[number];

/**
 * Why a lot's quantity on hand was set by hand (a stock adjustment): a recount
 * differed, a container was spilled or damaged, the lot was disposed of
 * (expired or off-spec), a sample was sent out, or something else (a note says what).
 */
export const LOT_ADJUSTMENT_REASONS = ["recount", "damaged", "disposed", "sample", "other"] as const;
export type LotAdjustmentReason = (typeof LOT_ADJUSTMENT_REASONS)[number];

/** What an uploaded spreadsheet holds: one formulation, or rows of materials. */
export const IMPORT_KINDS = ["formulation", "materials"] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];

/** An import waits "ready" between upload and confirmation, then is "confirmed". */
export const IMPORT_STATES = ["ready", "confirmed"] as const;
export type ImportState = (typeof IMPORT_STATES)[number];

/** Every event the audit trail records ("record.what_happened"). */
export const AUDIT_ACTIONS = [
  "formulation.created",
  "revision.saved",
  "revision.seeded",
  "revision.started",
  "revision.submitted",
  "revision.approved",
  "revision.returned",
  "revision.released",
  "revision.archived",
  "material.created",
  "material.updated",
  "material.deleted",
  "member.role_changed",
  "member.removed",
  "member.invited",
  "member.joined",
  "batch.started",
  "batch.line_recorded",
  "batch.notes_changed",
  "batch.closed",
  "batch.settings_changed",
  "team.currency_changed",
  "attachment.added",
  "lot.received",
  "lot.updated",
  "lot.adjusted",
  "batch.lot_chosen",
  "batch.result_entered",
  "batch.result_acknowledged",
  "batch.disposed",
  "revision.specifications_changed",
  "attachment.removed",
  "exploration.saved",
  "exploration.deleted",
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];
