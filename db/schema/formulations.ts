import {
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from "drizzle-orm/mysql-core";
import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import type { Specification } from "../../lib/quality/specification";
import { organization, user } from "./auth";
import { createdAt, teamRef, updatedAt, userRef, uuidPk } from "./columns";

/** The life of a revision, in the order it normally moves. */
import { REVIEW_DECISIONS, REVISION_STATES } from "../../lib/enums";
export { REVIEW_DECISIONS, REVISION_STATES };
export type { RevisionState } from "../../lib/enums";

export const formulations = mysqlTable(
  "formulations",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 200 }).notNull(),
    project: varchar("project", { length: 200 }),
    description: text("description"),
    /** State of the newest revision, kept here so lists filter and sort in SQL. */
    latestState: mysqlEnum("latest_state", REVISION_STATES).notNull().default("draft"),
    latestRevision: int("latest_revision").notNull().default(1),
    createdBy: userRef("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("formulations_team_name_uq").on(t.teamId, t.name),
    index("formulations_team_state_idx").on(t.teamId, t.latestState, t.updatedAt),
    index("formulations_team_updated_idx").on(t.teamId, t.updatedAt),
  ],
);

export const revisions = mysqlTable(
  "revisions",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    formulationId: varchar("formulation_id", { length: 36 })
      .notNull()
      .references(() => formulations.id, { onDelete: "cascade" }),
    /** 1, 2, 3 … within the formulation. */
    number: int("number").notNull(),
    state: mysqlEnum("state", REVISION_STATES).notNull().default("draft"),
    input: json("input").$type<FormulationInput>().notNull(),
    result: json("result").$type<FormulationResult | null>(),
    /** Test specifications production measures each batch against (lib/quality/specification.ts); approved with the revision. */
    specifications: json("specifications").$type<Specification[]>(),
    /** Message of the engine error when the input could not be computed. */
    computeError: text("compute_error"),
    engineVersion: varchar("engine_version", { length: 20 }).notNull(),
    /** Optimistic-locking counter: every save must carry the value it read. */
    version: int("version").notNull().default(1),
    authorId: userRef("author_id").references(() => user.id, { onDelete: "set null" }),
    submittedAt: timestamp("submitted_at", { fsp: 3 }),
    approvedAt: timestamp("approved_at", { fsp: 3 }),
    approvedBy: userRef("approved_by").references(() => user.id, { onDelete: "set null" }),
    releasedAt: timestamp("released_at", { fsp: 3 }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("revisions_formulation_number_uq").on(t.formulationId, t.number),
    index("revisions_team_state_idx").on(t.teamId, t.state),
  ],
);


export const reviews = mysqlTable(
  "reviews",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    revisionId: varchar("revision_id", { length: 36 })
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    reviewerId: userRef("reviewer_id").references(() => user.id, { onDelete: "set null" }),
    decision: mysqlEnum("decision", REVIEW_DECISIONS).notNull(),
    comment: text("comment"),
    createdAt: createdAt(),
  },
  (t) => [index("reviews_revision_idx").on(t.revisionId)],
);

export type FormulationRow = typeof formulations.$inferSelect;
export type NewFormulationRow = typeof formulations.$inferInsert;
export type RevisionRow = typeof revisions.$inferSelect;
export type NewRevisionRow = typeof revisions.$inferInsert;
export type ReviewRow = typeof reviews.$inferSelect;
