import { boolean, date, double, index, int, json, mysqlEnum, mysqlTable, text, timestamp, uniqueIndex, varchar } from "drizzle-orm/mysql-core";
import { BATCH_DISPOSITIONS, LOT_ADJUSTMENT_REASONS, LOT_UNITS } from "../../lib/enums";
import { organization, user } from "./auth";
import { createdAt, teamRef, updatedAt, userRef, uuidPk } from "./columns";
import { materials } from "./materials";
import { batchRecords } from "./records";

/**
 * A supplier lot of a team's material as received: supplier, the supplier's
 * lot number, quantity received and on hand (in `unit`), received and expiry
 * dates, and an optional measured assay that overrides the material's nominal
 * assay for batches using the lot. The certificate of analysis is an
 * attachment with owner type "lot".
 */
export const materialLots = mysqlTable(
  "material_lots",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    materialId: varchar("material_id", { length: 36 })
      .notNull()
      .references(() => materials.id, { onDelete: "restrict" }),
    supplier: varchar("supplier", { length: 200 }).notNull(),
    supplierLot: varchar("supplier_lot", { length: 100 }).notNull(),
    unit: mysqlEnum("unit", LOT_UNITS).notNull(),
    quantityReceived: double("quantity_received").notNull(),
    /** Never below 0: lowered in the transaction that releases a batch using the lot. */
    quantityOnHand: double("quantity_on_hand").notNull(),
    receivedOn: date("received_on", { mode: "string" }).notNull(),
    expiresOn: date("expires_on", { mode: "string" }),
    /** Measured mass fraction of the active compound (0–1), overriding the material's nominal assay. */
    measuredAssay: double("measured_assay"),
    notes: text("notes"),
    /** Raised by every correction of the lot (PATCH /api/lots/:id); a correction names the version it edits. */
    version: int("version").notNull().default(1),
    receivedBy: userRef("received_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("lots_team_material_lot_uq").on(t.teamId, t.materialId, t.supplierLot),
    index("lots_team_material_expiry_idx").on(t.teamId, t.materialId, t.expiresOn),
  ],
);

/**
 * A stock adjustment of a lot: its quantity on hand set by hand to what was
 * counted (a recount, a spill, a disposal, a sample sent out, or another
 * reason with a note), before and after in the lot's unit. Written in the
 * transaction that changes the lot, with the lot row locked.
 */
export const lotAdjustments = mysqlTable(
  "lot_adjustments",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    lotId: varchar("lot_id", { length: 36 })
      .notNull()
      .references(() => materialLots.id, { onDelete: "cascade" }),
    /** On hand before and after the adjustment, in the lot's unit. */
    quantityBefore: double("quantity_before").notNull(),
    quantityAfter: double("quantity_after").notNull(),
    /** The lot's version this adjustment made (newest first by it: two adjustments may share a millisecond). */
    lotVersion: int("lot_version").notNull(),
    reason: mysqlEnum("reason", LOT_ADJUSTMENT_REASONS).notNull(),
    /** Required for the reason "other", optional otherwise (at most 2000 characters). */
    note: text("note"),
    adjustedBy: userRef("adjusted_by").references(() => user.id, { onDelete: "set null" }),
    adjustedAt: timestamp("adjusted_at", { fsp: 3 }).defaultNow().notNull(),
  },
  (t) => [index("lot_adjustments_lot_idx").on(t.teamId, t.lotId, t.lotVersion)],
);

/** Which lot each batch line uses (one row per line that names a lot); `grams` taken at release. */
export const batchLotUses = mysqlTable(
  "batch_lot_uses",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    batchId: varchar("batch_id", { length: 36 })
      .notNull()
      .references(() => batchRecords.id, { onDelete: "cascade" }),
    /** Index of the line in the batch record's `lines`. */
    lineIndex: int("line_index").notNull(),
    lotId: varchar("lot_id", { length: 36 })
      .notNull()
      .references(() => materialLots.id, { onDelete: "restrict" }),
    /** Amount taken from the lot, in the lot's unit; set when the batch is released. */
    quantityUsed: double("quantity_used"),
    /**
     * The lot's measured assay when the batch was released (null: none was measured), so
     * a later correction of the lot's assay never changes what a released batch shows.
     */
    measuredAssayUsed: double("measured_assay_used"),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("lot_uses_batch_line_uq").on(t.batchId, t.lineIndex),
    index("lot_uses_lot_idx").on(t.teamId, t.lotId),
  ],
);

/**
 * One test result of a batch against one of its revision's specifications
 * (`specId` is the id of the specification inside the revision's
 * `specifications`): a number, or a text for a non-numeric property.
 */
export const batchResults = mysqlTable(
  "batch_results",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    batchId: varchar("batch_id", { length: 36 })
      .notNull()
      .references(() => batchRecords.id, { onDelete: "cascade" }),
    specId: varchar("spec_id", { length: 36 }).notNull(),
    valueNumber: double("value_number"),
    valueText: varchar("value_text", { length: 500 }),
    /** Marked when the result is entered: outside the specification's limits. */
    outOfSpec: boolean("out_of_spec").notNull().default(false),
    instrument: varchar("instrument", { length: 200 }),
    enteredBy: userRef("entered_by").references(() => user.id, { onDelete: "set null" }),
    enteredAt: timestamp("entered_at", { fsp: 3 }).defaultNow().notNull(),
    /** An out-of-specification result must be acknowledged (who, when, why) before the batch can be released. */
    acknowledgedBy: userRef("acknowledged_by").references(() => user.id, { onDelete: "set null" }),
    acknowledgedAt: timestamp("acknowledged_at", { fsp: 3 }),
    acknowledgement: text("acknowledgement"),
  },
  (t) => [index("results_batch_idx").on(t.teamId, t.batchId), index("results_spec_idx").on(t.teamId, t.specId)],
);

/** A batch's disposition: released for use, rejected, or released under deviation (with a justification). */
export const batchDispositions = mysqlTable(
  "batch_dispositions",
  {
    batchId: varchar("batch_id", { length: 36 })
      .primaryKey()
      .references(() => batchRecords.id, { onDelete: "cascade" }),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    disposition: mysqlEnum("disposition", BATCH_DISPOSITIONS).notNull(),
    justification: text("justification"),
    /** Weighing deviations acknowledged at disposition: line indexes with a note each. */
    acknowledgedDeviations: json("acknowledged_deviations").$type<{ lineIndex: number; note: string }[]>(),
    disposedBy: userRef("disposed_by").references(() => user.id, { onDelete: "set null" }),
    disposedAt: timestamp("disposed_at", { fsp: 3 }).defaultNow().notNull(),
  },
  (t) => [index("dispositions_team_idx").on(t.teamId, t.disposedAt)],
);

export type MaterialLotRow = typeof materialLots.$inferSelect;
export type LotAdjustmentRow = typeof lotAdjustments.$inferSelect;
export type BatchLotUseRow = typeof batchLotUses.$inferSelect;
export type BatchResultRow = typeof batchResults.$inferSelect;
export type BatchDispositionRow = typeof batchDispositions.$inferSelect;
