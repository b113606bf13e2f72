import { bigint, double, index, json, mysqlEnum, mysqlTable, text, timestamp, varchar } from "drizzle-orm/mysql-core";
import type { LineValues } from "../../lib/batches/lines";
import { BATCH_STATES, IMPORT_KINDS, IMPORT_STATES, type AuditAction } from "../../lib/enums";
export { BATCH_STATES, IMPORT_KINDS, IMPORT_STATES };
import { organization, user } from "./auth";
import { createdAt, teamRef, updatedAt, userRef, uuidPk } from "./columns";
import { revisions } from "./formulations";

/** Who did what, when: one row per state change or edit. Never updated. */
export const auditEvents = mysqlTable(
  "audit_events",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    actorId: userRef("actor_id").references(() => user.id, { onDelete: "set null" }),
    action: varchar("action", { length: 64 }).$type<AuditAction>().notNull(),
    entityType: varchar("entity_type", { length: 32 }).notNull(),
    entityId: varchar("entity_id", { length: 36 }).notNull(),
    summary: json("summary").$type<{ before?: unknown; after?: unknown; note?: string }>(),
    createdAt: createdAt(),
  },
  (t) => [
    index("audit_team_created_idx").on(t.teamId, t.createdAt),
    index("audit_entity_idx").on(t.entityType, t.entityId),
  ],
);


/** One line of a batch record: target from the released revision, actual values from production (lib/batches/lines.ts). */
export type BatchLine = LineValues;

/** A team's batch settings; when absent, the defaults in lib/batches apply. */
export const batchSettings = mysqlTable("batch_settings", {
  teamId: varchar("team_id", { length: 36 })
    .primaryKey()
    .references(() => organization.id, { onDelete: "cascade" }),
  toleranceFraction: double("tolerance_fraction").notNull(),
  balanceResolutionGrams: double("balance_resolution_grams").notNull(),
  updatedBy: userRef("updated_by").references(() => user.id, { onDelete: "set null" }),
  updatedAt: updatedAt(),
});

/**
 * A team's own settings that are not about batches (today: the currency its
 * material prices are in). Its own table rather than a column on
 * batch_settings: every member reads it, and a team that never set a batch
 * tolerance still has a currency. When absent, lib/currency.ts's default applies.
 */
export const teamSettings = mysqlTable("team_settings", {
  teamId: varchar("team_id", { length: 36 })
    .primaryKey()
    .references(() => organization.id, { onDelete: "cascade" }),
  /** ISO 4217 three-letter code, upper case. */
  currency: varchar("currency", { length: 3 }).notNull(),
  updatedBy: userRef("updated_by").references(() => user.id, { onDelete: "set null" }),
  updatedAt: updatedAt(),
});

/** One batch made in production from a released revision. */
export const batchRecords = mysqlTable(
  "batch_records",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    revisionId: varchar("revision_id", { length: 36 })
      .notNull()
      .references(() => revisions.id, { onDelete: "restrict" }),
    state: mysqlEnum("state", BATCH_STATES).notNull().default("open"),
    /** Per line: the target copied from the revision at start, then actual mass (g), lot number, time, initials. */
    lines: json("lines").$type<BatchLine[]>().notNull(),
    notes: text("notes"),
    /** Relative tolerance on each line's mass (0.01 = ±1 %), fixed when the batch starts. */
    toleranceFraction: double("tolerance_fraction").notNull().default(0.01),
    /** Readability of the balance (g); a line's tolerance is never below it. */
    balanceResolutionGrams: double("balance_resolution_grams").notNull().default(0.01),
    startedBy: userRef("started_by").references(() => user.id, { onDelete: "set null" }),
    closedBy: userRef("closed_by").references(() => user.id, { onDelete: "set null" }),
    closedAt: timestamp("closed_at", { fsp: 3 }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("batch_team_revision_idx").on(t.teamId, t.revisionId)],
);

/** Metadata of an uploaded file (safety data sheet, certificate of analysis). */
export const attachments = mysqlTable(
  "attachments",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    ownerType: varchar("owner_type", { length: 32 }).notNull(),
    ownerId: varchar("owner_id", { length: 36 }).notNull(),
    /** "sds" (safety data sheet), "coa" (certificate of analysis) or "other". */
    kind: varchar("kind", { length: 16 }).notNull().default("other"),
    fileName: varchar("file_name", { length: 255 }).notNull(),
    contentType: varchar("content_type", { length: 100 }).notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    storageKey: varchar("storage_key", { length: 255 }).notNull(),
    uploadedBy: userRef("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("attachments_owner_idx").on(t.teamId, t.ownerType, t.ownerId)],
);


/**
 * An import between upload and confirmation: the parsed preview, kept on the
 * server (so any app instance can confirm it) until it expires.
 */
export const importPreviews = mysqlTable(
  "import_previews",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    userId: userRef("user_id").references(() => user.id, { onDelete: "cascade" }),
    kind: mysqlEnum("kind", IMPORT_KINDS).notNull(),
    fileName: varchar("file_name", { length: 255 }).notNull(),
    state: mysqlEnum("state", IMPORT_STATES).notNull().default("ready"),
    preview: json("preview").$type<Record<string, unknown>>().notNull(),
    /** What the confirmation saved (formulation and revision ids, material ids). */
    outcome: json("outcome").$type<Record<string, unknown>>(),
    expiresAt: timestamp("expires_at", { fsp: 3 }).notNull(),
    confirmedAt: timestamp("confirmed_at", { fsp: 3 }),
    createdAt: createdAt(),
  },
  (t) => [index("import_previews_team_idx").on(t.teamId, t.createdAt)],
);

export type AuditEventRow = typeof auditEvents.$inferSelect;
export type NewAuditEventRow = typeof auditEvents.$inferInsert;
export type BatchRecordRow = typeof batchRecords.$inferSelect;
export type AttachmentRow = typeof attachments.$inferSelect;
export type ImportPreviewRow = typeof importPreviews.$inferSelect;
export type BatchSettingsRow = typeof batchSettings.$inferSelect;
export type TeamSettingsRow = typeof teamSettings.$inferSelect;
