import type { AuditAction } from "@/lib/enums";
import { and, desc, eq, gte, lte, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import type { DbOrTx } from "@/db/client";
import { auditEvents, user, type NewAuditEventRow } from "@/db/schema";

/** Writes one audit event; call it inside the transaction of the change it records. */
export async function recordEvent(tx: DbOrTx, event: Omit<NewAuditEventRow, "id" | "createdAt">): Promise<void> {
  await tx.insert(auditEvents).values(event);
}

export interface AuditFilter {
  entityId?: string;
  entityType?: string;
  actorId?: string;
  action?: AuditAction;
  from?: Date;
  to?: Date;
  page?: number;
  pageSize?: number;
}

export async function listAuditEvents(teamId: string, filter: AuditFilter = {}) {
  const where: SQL[] = [eq(auditEvents.teamId, teamId)];
  if (filter.entityId) where.push(eq(auditEvents.entityId, filter.entityId));
  if (filter.entityType) where.push(eq(auditEvents.entityType, filter.entityType));
  if (filter.actorId) where.push(eq(auditEvents.actorId, filter.actorId));
  if (filter.action) where.push(eq(auditEvents.action, filter.action));
  if (filter.from) where.push(gte(auditEvents.createdAt, filter.from));
  if (filter.to) where.push(lte(auditEvents.createdAt, filter.to));
  const pageSize = Math.min(filter.pageSize ?? 50, 200);
  const page = Math.max(filter.page ?? 1, 1);
  const [rows, [count]] = await Promise.all([
    db
      .select({
        id: auditEvents.id,
        action: auditEvents.action,
        entityType: auditEvents.entityType,
        entityId: auditEvents.entityId,
        summary: auditEvents.summary,
        createdAt: auditEvents.createdAt,
        actorId: auditEvents.actorId,
        actorName: user.name,
        actorEmail: user.email,
      })
      .from(auditEvents)
      .leftJoin(user, eq(user.id, auditEvents.actorId))
      .where(and(...where))
      .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db.select({ n: sql<number>`count(*)` }).from(auditEvents).where(and(...where)),
  ]);
  return { rows, total: Number(count?.n ?? 0), page, pageSize };
}
