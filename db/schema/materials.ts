import { index, json, mysqlTable, uniqueIndex, varchar, mysqlEnum } from "drizzle-orm/mysql-core";
import type { Material } from "@/lib/formulation";
import { organization, user } from "./auth";
import { createdAt, teamRef, updatedAt, userRef, uuidPk } from "./columns";

import { MATERIAL_KINDS } from "../../lib/formulation/kinds";
export { MATERIAL_KINDS };

/**
 * A team's materials library. `data` holds the engine's Material record
 * (properties, sources, hazards); name, kind and CAS number are columns so the
 * library can be searched and sorted in SQL.
 */
export const materials = mysqlTable(
  "materials",
  {
    id: uuidPk(),
    teamId: teamRef().references(() => organization.id, { onDelete: "cascade" }),
    /** Reference-data id this row was copied from (e.g. "teos"), if any. */
    referenceId: varchar("reference_id", { length: 64 }),
    name: varchar("name", { length: 200 }).notNull(),
    kind: mysqlEnum("kind", MATERIAL_KINDS).notNull(),
    casNumber: varchar("cas_number", { length: 20 }),
    data: json("data").$type<Material>().notNull(),
    createdBy: userRef("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("materials_team_name_uq").on(t.teamId, t.name),
    index("materials_team_kind_idx").on(t.teamId, t.kind),
  ],
);

export type MaterialRow = typeof materials.$inferSelect;
export type NewMaterialRow = typeof materials.$inferInsert;
