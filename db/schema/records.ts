import { bigint, index, json, mysqlEnum, mysqlTable, text, timestamp, varchar } from "drizzle-orm/mysql-core";
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
    action: varchar("action", { length: 64 }).notNull(),
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

export const BATCH_STATES = ["open", "closed"] as const;

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
    /** Per line: material id, actual mass (g), lot number, time, initials. */
    lines: json("lines")
      .$type<{ materialId: string; actualGrams: number | null; lotNumber: string | null; at?: string; initials?: string }[]>()
      .notNull(),
    notes: text("notes"),
    startedBy: userRef("started_by").references(() => user.id, { onDelete: "set null" }),
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
    fileName: varchar("file_name", { length: 255 }).notNull(),
    contentType: varchar("content_type", { length: 100 }).notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    storageKey: varchar("storage_key", { length: 255 }).notNull(),
    uploadedBy: userRef("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("attachments_owner_idx").on(t.teamId, t.ownerType, t.ownerId)],
);

export type AuditEventRow = typeof auditEvents.$inferSelect;
export type NewAuditEventRow = typeof auditEvents.$inferInsert;
export type BatchRecordRow = typeof batchRecords.$inferSelect;
export type AttachmentRow = typeof attachments.$inferSelect;
