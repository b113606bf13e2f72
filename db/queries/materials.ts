import { and, asc, desc, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { materials, MATERIAL_KINDS, type MaterialRow } from "@/db/schema";
import type { Material } from "@/lib/formulation";
import { onDuplicate } from "../errors";
import { recordEvent } from "./audit";

/**
 * The unique key refuses a name the library has, also when two people save
 * at the same moment: a ConflictError naming material.name.
 */
const nameTaken = (name: string) => onDuplicate("materials_team_name_uq", `The library already has a material named "${name}".`);

export type MaterialKind = (typeof MATERIAL_KINDS)[number];

export interface MaterialListQuery {
  q?: string;
  kind?: MaterialKind;
  sort?: "name" | "kind" | "updatedAt";
  dir?: "asc" | "desc";
  page?: number;
  pageSize?: number;
}

/** A row as the API returns it: the Material record with the row's id. */
export function toMaterial(row: MaterialRow): Material & { updatedAt: Date; referenceId: string | null } {
  return {
    ...row.data,
    id: row.id,
    name: row.name,
    kind: row.kind,
    casNumber: row.casNumber ?? undefined,
    referenceId: row.referenceId,
    updatedAt: row.updatedAt,
  };
}

export async function listMaterials(teamId: string, query: MaterialListQuery = {}) {
  const where: SQL[] = [eq(materials.teamId, teamId)];
  if (query.kind) where.push(eq(materials.kind, query.kind));
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(or(like(materials.name, pattern), like(materials.casNumber, pattern))!);
  }
  const column = { name: materials.name, kind: materials.kind, updatedAt: materials.updatedAt }[query.sort ?? "name"];
  const order = query.dir === "desc" ? desc(column) : asc(column);
  const pageSize = Math.min(query.pageSize ?? 50, 500);
  const page = Math.max(query.page ?? 1, 1);
  const [rows, [count]] = await Promise.all([
    db.select().from(materials).where(and(...where)).orderBy(order, asc(materials.id)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: sql<number>`count(*)` }).from(materials).where(and(...where)),
  ]);
  return { rows: rows.map(toMaterial), total: Number(count?.n ?? 0), page, pageSize };
}

export async function getMaterial(teamId: string, id: string) {
  const [row] = await db.select().from(materials).where(and(eq(materials.teamId, teamId), eq(materials.id, id))).limit(1);
  return row ? toMaterial(row) : null;
}

export async function getMaterialsByIds(teamId: string, ids: string[]) {
  if (ids.length === 0) return [];
  const rows = await db.select().from(materials).where(and(eq(materials.teamId, teamId), inArray(materials.id, ids)));
  return rows.map(toMaterial);
}

function stripId(m: Material): Material {
  const rest = { ...m } as Material & { updatedAt?: unknown; casNumber?: unknown; referenceId?: unknown };
  delete rest.updatedAt;
  delete rest.referenceId;
  return { ...rest, id: "" };
}

export async function createMaterial(teamId: string, userId: string, material: Material, casNumber?: string | null) {
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(materials).values({
      id,
      teamId,
      name: material.name,
      kind: material.kind,
      casNumber: casNumber ?? material.casNumber ?? null,
      data: { ...stripId(material), id },
      createdBy: userId,
    });
    await recordEvent(tx, {
      teamId,
      actorId: userId,
      action: "material.created",
      entityType: "material",
      entityId: id,
      summary: { after: { name: material.name, kind: material.kind } },
    });
  }).catch(nameTaken(material.name));
  return (await getMaterial(teamId, id))!;
}

/** Updates a material; returns null when it is not in this team. */
export async function updateMaterial(teamId: string, userId: string, id: string, material: Material, casNumber?: string | null) {
  const before = await getMaterial(teamId, id);
  if (!before) return null;
  await db.transaction(async (tx) => {
    await tx
      .update(materials)
      .set({ name: material.name, kind: material.kind, casNumber: casNumber ?? material.casNumber ?? null, data: { ...stripId(material), id } })
      .where(and(eq(materials.teamId, teamId), eq(materials.id, id)));
    await recordEvent(tx, {
      teamId,
      actorId: userId,
      action: "material.updated",
      entityType: "material",
      entityId: id,
      summary: { before: { name: before.name, kind: before.kind }, after: { name: material.name, kind: material.kind } },
    });
  }).catch(nameTaken(material.name));
  return getMaterial(teamId, id);
}

export async function deleteMaterial(teamId: string, userId: string, id: string): Promise<boolean> {
  const before = await getMaterial(teamId, id);
  if (!before) return false;
  await db.transaction(async (tx) => {
    await tx.delete(materials).where(and(eq(materials.teamId, teamId), eq(materials.id, id)));
    await recordEvent(tx, {
      teamId,
      actorId: userId,
      action: "material.deleted",
      entityType: "material",
      entityId: id,
      summary: { before: { name: before.name, kind: before.kind } },
    });
  });
  return true;
}
