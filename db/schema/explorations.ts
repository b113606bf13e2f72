import { index, int, json, mysqlTable, varchar } from "drizzle-orm/mysql-core";
import type { Candidate, Grid, OutputKey, Search } from "../../lib/explore/spec";
import { organization, user } from "./auth";
import { createdAt, teamRef, userRef, uuidPk } from "./columns";
import { formulations, revisions } from "./formulations";

/**
 * A saved exploration of one revision (the design explorer, issue 16): what
 * varied (`grid`), the figures shown (`outputs`), the target search and the
 * best candidates it found, when one ran. It never changes the revision; the
 * points themselves are not stored (the export computes them again from the
 * revision's input).
 */
export const explorations = mysqlTable(
  "explorations",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    formulationId: varchar("formulation_id", { length: 36 })
      .notNull()
      .references(() => formulations.id, { onDelete: "cascade" }),
    revisionId: varchar("revision_id", { length: 36 })
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 200 }).notNull(),
    grid: json("grid").$type<Grid>().notNull(),
    outputs: json("outputs").$type<OutputKey[]>().notNull(),
    search: json("search").$type<Search | null>(),
    candidates: json("candidates").$type<Candidate[] | null>(),
    /** Points the grid has (at most EXPLORE_MAX_POINTS). */
    pointCount: int("point_count").notNull(),
    createdBy: userRef("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("explorations_team_formulation_idx").on(t.teamId, t.formulationId, t.createdAt),
    index("explorations_revision_idx").on(t.revisionId, t.createdAt),
  ],
);

export type ExplorationRow = typeof explorations.$inferSelect;
export type NewExplorationRow = typeof explorations.$inferInsert;
