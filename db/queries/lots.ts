/**
 * Material lots: receiving, listing in stock (earliest expiry first), a lot
 * with its uses, a batch line choosing a lot, and traceability both ways.
 */
import { and, asc, desc, eq, gt, inArray, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { onDuplicate } from "@/db/errors";
import { batchDispositions, batchLotUses, batchRecords, formulations, materialLots, materials, revisions, user, type BatchLine } from "@/db/schema";
import { ConflictError, NotFoundError, RuleError } from "@/lib/errors";
import type { LotUnit } from "@/lib/enums";
import { correctedGrams, gramsInLotUnit } from "@/lib/quality/lot-amount";
import { LOT_CORRECTION_FIELDS, type CorrectLotInput, type ReceiveLotInput } from "@/lib/validations/lots";
import { recordEvent } from "./audit";

export interface Actor {
  userId: string;
  teamId: string;
}

/** Today's date (UTC) as YYYY-MM-DD: a lot expiring before it is expired. */
export function today(): string {
  return new Date().toISOString().slice(0, 10);
}

const lotColumns = {
  id: materialLots.id,
  materialId: materialLots.materialId,
  materialName: materials.name,
  supplier: materialLots.supplier,
  supplierLot: materialLots.supplierLot,
  unit: materialLots.unit,
  quantityReceived: materialLots.quantityReceived,
  quantityOnHand: materialLots.quantityOnHand,
  receivedOn: materialLots.receivedOn,
  expiresOn: materialLots.expiresOn,
  measuredAssay: materialLots.measuredAssay,
  notes: materialLots.notes,
  version: materialLots.version,
  receivedBy: materialLots.receivedBy,
  receivedByName: user.name,
  createdAt: materialLots.createdAt,
};

/** Receives a lot of a team's material; a supplier lot number already received for the material is a 409 naming supplierLot. */
export async function receiveLot(actor: Actor, input: ReceiveLotInput) {
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    const [m] = await tx
      .select({ id: materials.id, name: materials.name })
      .from(materials)
      .where(and(eq(materials.teamId, actor.teamId), eq(materials.id, input.materialId)))
      .limit(1);
    if (!m) throw new RuleError("unknown_material", "There is no such material in this team's library.", "materialId");
    await tx
      .insert(materialLots)
      .values({
        id,
        teamId: actor.teamId,
        materialId: m.id,
        supplier: input.supplier,
        supplierLot: input.supplierLot,
        unit: input.unit,
        quantityReceived: input.quantity,
        quantityOnHand: input.quantity,
        receivedOn: input.receivedOn,
        expiresOn: input.expiresOn ?? null,
        measuredAssay: input.measuredAssay ?? null,
        notes: input.notes?.trim() || null,
        receivedBy: actor.userId,
      })
      .catch(onDuplicate("lots_team_material_lot_uq", `${m.name} already has a lot "${input.supplierLot}" received.`));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "lot.received",
      entityType: "lot",
      entityId: id,
      summary: { after: { material: m.name, supplier: input.supplier, supplierLot: input.supplierLot, quantity: input.quantity, unit: input.unit, expiresOn: input.expiresOn ?? null } },
    });
  });
  return (await getLot(actor.teamId, id))!;
}

type CorrectionField = (typeof LOT_CORRECTION_FIELDS)[number];

/**
 * Corrects a received lot (supplier, supplier lot number, expiry date,
 * measured assay, notes; never the quantities, which change only through
 * releases). `version` is the lot's counter the client read: when someone
 * corrected the lot in between, nothing is written (409). The lot row is
 * locked for the transaction, so a release taking from the lot at the same
 * moment waits (or is waited for) and neither change is lost. A supplier lot
 * number the material already has is a 409 naming supplierLot. The audit
 * event `lot.updated` carries the changed fields only, before and after.
 * Batches already released keep the assay they were released with
 * (`batch_lot_uses.measured_assay_used`).
 */
export async function correctLot(actor: Actor, lotId: string, input: CorrectLotInput) {
  await db.transaction(async (tx) => {
    const [current] = await tx
      .select({ lot: materialLots, materialName: materials.name })
      .from(materialLots)
      .innerJoin(materials, eq(materials.id, materialLots.materialId))
      .where(and(eq(materialLots.teamId, actor.teamId), eq(materialLots.id, lotId)))
      .for("update")
      .limit(1);
    if (!current) throw new NotFoundError("material lot");
    const lot = current.lot;
    if (lot.version !== input.version) {
      throw new ConflictError(
        "conflict",
        `Someone changed this lot after you opened it (a correction or a stock adjustment; your copy is version ${input.version}, the saved one is ${lot.version}). Nothing was overwritten: reload to see their changes, then apply yours again.`,
        "version",
      );
    }
    const wanted: Record<CorrectionField, string | number | null | undefined> = {
      supplier: input.supplier,
      supplierLot: input.supplierLot,
      expiresOn: input.expiresOn,
      measuredAssay: input.measuredAssay,
      notes: input.notes === undefined ? undefined : input.notes?.trim() || null,
    };
    const before: Record<string, unknown> = {};
    const after: Record<string, unknown> = {};
    for (const field of LOT_CORRECTION_FIELDS) {
      const value = wanted[field];
      if (value === undefined || value === lot[field]) continue;
      before[field] = lot[field];
      after[field] = value;
    }
    const expiresOn = "expiresOn" in after ? (after.expiresOn as string | null) : lot.expiresOn;
    if (expiresOn !== null && expiresOn < lot.receivedOn) {
      throw new RuleError("expiry_before_received", `The expiry date must not be before the received date (${lot.receivedOn}).`, "expiresOn");
    }
    if (Object.keys(after).length === 0) return;
    const res = await tx
      .update(materialLots)
      .set({ ...after, version: lot.version + 1 })
      .where(and(eq(materialLots.id, lotId), eq(materialLots.version, input.version)))
      .catch(onDuplicate("lots_team_material_lot_uq", `${current.materialName} already has a lot "${input.supplierLot}" received.`));
    if (res[0].affectedRows !== 1) throw new ConflictError("conflict", "This lot changed while saving; reload and try again.", "version");
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "lot.updated",
      entityType: "lot",
      entityId: lotId,
      summary: { before: { ...before, version: lot.version }, after: { ...after, version: lot.version + 1 } },
    });
  });
  return (await getLot(actor.teamId, lotId))!;
}

/**
 * The team's lots, by material; `inStock` keeps those with something on hand
 * that are not expired. Earliest expiry first (no expiry last), then oldest received.
 */
export async function listLots(teamId: string, filter: { materialId?: string; inStock?: boolean } = {}) {
  const where: SQL[] = [eq(materialLots.teamId, teamId)];
  if (filter.materialId) where.push(eq(materialLots.materialId, filter.materialId));
  if (filter.inStock) {
    where.push(gt(materialLots.quantityOnHand, 0));
    where.push(sql`(${materialLots.expiresOn} is null or ${materialLots.expiresOn} >= ${today()})`);
  }
  const rows = await db
    .select(lotColumns)
    .from(materialLots)
    .innerJoin(materials, eq(materials.id, materialLots.materialId))
    .leftJoin(user, eq(user.id, materialLots.receivedBy))
    .where(and(...where))
    .orderBy(sql`${materialLots.expiresOn} is null`, asc(materialLots.expiresOn), asc(materialLots.receivedOn), asc(materialLots.supplierLot))
    .limit(1000);
  const now = today();
  return { rows: rows.map((r) => ({ ...r, expired: r.expiresOn !== null && r.expiresOn < now })) };
}

/** One lot with every batch line that uses it (traceability: lot → batches). */
export async function getLot(teamId: string, id: string) {
  const [row] = await db
    .select(lotColumns)
    .from(materialLots)
    .innerJoin(materials, eq(materials.id, materialLots.materialId))
    .leftJoin(user, eq(user.id, materialLots.receivedBy))
    .where(and(eq(materialLots.teamId, teamId), eq(materialLots.id, id)))
    .limit(1);
  if (!row) return null;
  const uses = await db
    .select({
      batchId: batchLotUses.batchId,
      lineIndex: batchLotUses.lineIndex,
      quantityUsed: batchLotUses.quantityUsed,
      batchState: batchRecords.state,
      batchStartedAt: batchRecords.createdAt,
      batchClosedAt: batchRecords.closedAt,
      formulationId: formulations.id,
      formulationName: formulations.name,
      revisionNumber: revisions.number,
      disposition: batchDispositions.disposition,
      disposedAt: batchDispositions.disposedAt,
    })
    .from(batchLotUses)
    .innerJoin(batchRecords, eq(batchRecords.id, batchLotUses.batchId))
    .innerJoin(revisions, eq(revisions.id, batchRecords.revisionId))
    .innerJoin(formulations, eq(formulations.id, revisions.formulationId))
    .leftJoin(batchDispositions, eq(batchDispositions.batchId, batchLotUses.batchId))
    .where(and(eq(batchLotUses.teamId, teamId), eq(batchLotUses.lotId, id)))
    .orderBy(desc(batchRecords.createdAt), asc(batchLotUses.lineIndex));
  return { ...row, expired: row.expiresOn !== null && row.expiresOn < today(), uses };
}
export type LotView = NonNullable<Awaited<ReturnType<typeof getLot>>>;

/** The amount of a line (actual when weighed, else target), g. */
export function lineGrams(line: BatchLine): number | null {
  return line.actualGrams ?? line.targetGrams ?? null;
}

/** A line's amount in a lot's unit; a RuleError naming the line when a volume unit lacks the material's density. */
export function lineAmountInLotUnit(line: BatchLine, index: number, unit: LotUnit, density: number | undefined): number {
  const grams = lineGrams(line) ?? 0;
  const amount = gramsInLotUnit(grams, unit, density);
  if (amount === null) {
    throw new RuleError("no_density", `Line ${index + 1} (${line.name ?? line.materialId}): the lot is counted in ${unit} and the material has no density to convert its mass.`, "lotId");
  }
  return amount;
}

/**
 * A line of an open batch takes from a lot (or, with null, no longer does):
 * the lot must be of the line's material, not expired, not used up, and hold
 * at least the line's amount. The line's lot number text follows (the
 * supplier lot number), so sheets keep showing it.
 */
export async function chooseLot(actor: Actor, batchId: string, index: number, lotId: string | null) {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(batchRecords)
      .where(and(eq(batchRecords.teamId, actor.teamId), eq(batchRecords.id, batchId)))
      .for("update")
      .limit(1);
    if (!row) throw new NotFoundError("batch record");
    if (row.state === "closed") throw new ConflictError("conflict", "This batch record is closed and can no longer change.");
    const line = row.lines[index];
    if (!line) throw new NotFoundError("line", `This batch has no line ${index + 1}.`);
    const label = `Line ${index + 1} (${line.name ?? line.materialId})`;
    const [before] = await tx
      .select({ lotId: batchLotUses.lotId })
      .from(batchLotUses)
      .where(and(eq(batchLotUses.batchId, batchId), eq(batchLotUses.lineIndex, index)))
      .limit(1);
    let lotNumber: string | null = null;
    if (lotId) {
      const [lot] = await tx
        .select({ lot: materialLots, materialData: materials.data, referenceId: materials.referenceId })
        .from(materialLots)
        .innerJoin(materials, eq(materials.id, materialLots.materialId))
        .where(and(eq(materialLots.teamId, actor.teamId), eq(materialLots.id, lotId)))
        .limit(1);
      if (!lot) throw new RuleError("unknown_lot", "There is no such lot in this team.", "lotId");
      const l = lot.lot;
      if (l.materialId !== line.materialId && lot.materialData.id !== line.materialId && lot.referenceId !== line.materialId) {
        throw new RuleError("wrong_material", `${label}: lot ${l.supplierLot} is of another material.`, "lotId");
      }
      if (l.expiresOn !== null && l.expiresOn < today()) {
        throw new RuleError("lot_expired", `${label}: lot ${l.supplierLot} expired on ${l.expiresOn}; choose a lot in date.`, "lotId");
      }
      if (l.quantityOnHand <= 0) {
        throw new RuleError("lot_used_up", `${label}: lot ${l.supplierLot} is used up (nothing on hand).`, "lotId");
      }
      const need = lineAmountInLotUnit(line, index, l.unit, lot.materialData.density);
      if (need > l.quantityOnHand) {
        throw new RuleError(
          "lot_short",
          `${label} needs ${fmt(need)} ${l.unit} and lot ${l.supplierLot} has only ${fmt(l.quantityOnHand)} ${l.unit} on hand.`,
          "lotId",
        );
      }
      lotNumber = l.supplierLot;
      if (before) {
        await tx.update(batchLotUses).set({ lotId }).where(and(eq(batchLotUses.batchId, batchId), eq(batchLotUses.lineIndex, index)));
      } else {
        await tx.insert(batchLotUses).values({ teamId: actor.teamId, batchId, lineIndex: index, lotId });
      }
    } else if (before) {
      await tx.delete(batchLotUses).where(and(eq(batchLotUses.batchId, batchId), eq(batchLotUses.lineIndex, index)));
    }
    const lines = row.lines.map((l, i) => (i === index ? { ...l, lotNumber } : l));
    await tx.update(batchRecords).set({ lines }).where(eq(batchRecords.id, batchId));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "batch.lot_chosen",
      entityType: "batch",
      entityId: batchId,
      summary: { before: { line: index + 1, lotId: before?.lotId ?? null, lotNumber: line.lotNumber }, after: { line: index + 1, lotId, lotNumber } },
    });
  });
  return batchLots(actor.teamId, batchId);
}

/** An amount for a message: 6 significant digits, no trailing zeros (e.g. 2.35). */
export const fmt = (n: number) => String(Number(n.toPrecision(6)));

/**
 * The lots in a batch, line by line (traceability: batch → lots), each with
 * the corrected mass when its lot has a measured assay (for a released
 * batch, the assay its lot had at release).
 */
export async function batchLots(teamId: string, batchId: string) {
  const [b] = await db
    .select({ id: batchRecords.id, lines: batchRecords.lines, state: batchRecords.state })
    .from(batchRecords)
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, batchId)))
    .limit(1);
  if (!b) return null;
  const uses = await db
    .select({
      lineIndex: batchLotUses.lineIndex,
      quantityUsed: batchLotUses.quantityUsed,
      lotId: materialLots.id,
      supplier: materialLots.supplier,
      supplierLot: materialLots.supplierLot,
      unit: materialLots.unit,
      quantityOnHand: materialLots.quantityOnHand,
      expiresOn: materialLots.expiresOn,
      lotAssay: materialLots.measuredAssay,
      measuredAssayUsed: batchLotUses.measuredAssayUsed,
      materialName: materials.name,
      materialData: materials.data,
    })
    .from(batchLotUses)
    .innerJoin(materialLots, eq(materialLots.id, batchLotUses.lotId))
    .innerJoin(materials, eq(materials.id, materialLots.materialId))
    .where(and(eq(batchLotUses.teamId, teamId), eq(batchLotUses.batchId, batchId)))
    .orderBy(asc(batchLotUses.lineIndex));
  return {
    batchId,
    rows: uses.map(({ materialData, lotAssay, measuredAssayUsed, ...rest }) => {
      // A released use keeps the assay it was released with; a later correction of the lot shows only on open batches.
      const u = { ...rest, measuredAssay: rest.quantityUsed !== null ? measuredAssayUsed : lotAssay };
      const line = b.lines[u.lineIndex];
      const grams = line ? lineGrams(line) : null;
      const nominal = materialData.assay ?? 1;
      return {
        ...u,
        lineName: line?.name ?? line?.materialId ?? null,
        grams,
        nominalAssay: nominal,
        correctedGrams: u.measuredAssay !== null && grams !== null && line?.targetGrams !== undefined ? correctedGrams(line.targetGrams, nominal, u.measuredAssay) : null,
      };
    }),
  };
}
export type BatchLotsView = NonNullable<Awaited<ReturnType<typeof batchLots>>>;

/** Lots by id of the team (for the lot picker: the lots of several materials at once). */
export async function lotsOfMaterials(teamId: string, materialIds: string[]) {
  if (materialIds.length === 0) return [];
  return db
    .select({ id: materialLots.id, materialId: materialLots.materialId, supplierLot: materialLots.supplierLot, unit: materialLots.unit, quantityOnHand: materialLots.quantityOnHand, expiresOn: materialLots.expiresOn })
    .from(materialLots)
    .where(and(eq(materialLots.teamId, teamId), inArray(materialLots.materialId, materialIds), gt(materialLots.quantityOnHand, 0), sql`(${materialLots.expiresOn} is null or ${materialLots.expiresOn} >= ${today()})`))
    .orderBy(sql`${materialLots.expiresOn} is null`, asc(materialLots.expiresOn));
}
