import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { attachments, batchRecords, materialLots, materials, user, type AttachmentRow } from "@/db/schema";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { deleteObject, putObject, signedDownloadUrl } from "@/lib/storage";
import { ATTACHMENT_KINDS, ATTACHMENT_OWNER_TYPES } from "@/lib/validations/uploads";
import { recordEvent } from "./audit";

export interface Actor {
  userId: string;
  teamId: string;
}

export type OwnerType = (typeof ATTACHMENT_OWNER_TYPES)[number];
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

/**
 * Whether the owner exists in the team; for a batch also whether it is still
 * open (closed batch records never change, attachments included).
 */
export async function findOwner(teamId: string, ownerType: OwnerType, ownerId: string): Promise<{ open: boolean } | null> {
  if (ownerType === "material") {
    const [m] = await db.select({ id: materials.id }).from(materials).where(and(eq(materials.teamId, teamId), eq(materials.id, ownerId))).limit(1);
    return m ? { open: true } : null;
  }
  if (ownerType === "lot") {
    const [l] = await db.select({ id: materialLots.id }).from(materialLots).where(and(eq(materialLots.teamId, teamId), eq(materialLots.id, ownerId))).limit(1);
    return l ? { open: true } : null;
  }
  const [b] = await db
    .select({ state: batchRecords.state })
    .from(batchRecords)
    .where(and(eq(batchRecords.teamId, teamId), eq(batchRecords.id, ownerId)))
    .limit(1);
  return b ? { open: b.state === "open" } : null;
}

/** The word for an owner type in a 404 message. */
export function ownerWord(ownerType: OwnerType): string {
  return ownerType === "material" ? "material" : ownerType === "lot" ? "material lot" : "batch record";
}

const closed = () => new ConflictError("conflict", "This batch record is closed and can no longer change.");

function view(row: AttachmentRow & { uploadedByName?: string | null }) {
  return {
    id: row.id,
    ownerType: row.ownerType as OwnerType,
    ownerId: row.ownerId,
    kind: row.kind as AttachmentKind,
    fileName: row.fileName,
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
    uploadedBy: row.uploadedBy,
    uploadedByName: row.uploadedByName ?? null,
    createdAt: row.createdAt,
  };
}

/** Stores the file, then its metadata; the object is removed again if the metadata cannot be saved. */
export async function createAttachment(
  actor: Actor,
  data: { ownerType: OwnerType; ownerId: string; kind: AttachmentKind; fileName: string; contentType: string; bytes: Uint8Array },
) {
  const owner = await findOwner(actor.teamId, data.ownerType, data.ownerId);
  if (!owner) throw new NotFoundError(ownerWord(data.ownerType));
  if (!owner.open) throw closed();
  const id = crypto.randomUUID();
  // The key never contains anything the user typed.
  const storageKey = `teams/${actor.teamId}/${data.ownerType}/${data.ownerId}/${id}.pdf`;
  await putObject(storageKey, data.bytes, data.contentType);
  try {
    await db.transaction(async (tx) => {
      await tx.insert(attachments).values({
        id,
        teamId: actor.teamId,
        ownerType: data.ownerType,
        ownerId: data.ownerId,
        kind: data.kind,
        fileName: data.fileName,
        contentType: data.contentType,
        sizeBytes: data.bytes.byteLength,
        storageKey,
        uploadedBy: actor.userId,
      });
      await recordEvent(tx, {
        teamId: actor.teamId,
        actorId: actor.userId,
        action: "attachment.added",
        entityType: data.ownerType,
        entityId: data.ownerId,
        summary: { after: { attachmentId: id, fileName: data.fileName, kind: data.kind, sizeBytes: data.bytes.byteLength } },
      });
    });
  } catch (err) {
    await deleteObject(storageKey).catch(() => undefined);
    throw err;
  }
  return (await getAttachment(actor.teamId, id))!;
}

/** An attachment of the team, or null. */
export async function getAttachment(teamId: string, id: string) {
  const [row] = await db
    .select({ a: attachments, uploadedByName: user.name })
    .from(attachments)
    .leftJoin(user, eq(user.id, attachments.uploadedBy))
    .where(and(eq(attachments.teamId, teamId), eq(attachments.id, id)))
    .limit(1);
  return row ? { ...view({ ...row.a, uploadedByName: row.uploadedByName }), storageKey: row.a.storageKey } : null;
}

/** Attachments of one owner, newest first. */
export async function listAttachments(teamId: string, ownerType: OwnerType, ownerId: string) {
  const rows = await db
    .select({ a: attachments, uploadedByName: user.name })
    .from(attachments)
    .leftJoin(user, eq(user.id, attachments.uploadedBy))
    .where(and(eq(attachments.teamId, teamId), eq(attachments.ownerType, ownerType), eq(attachments.ownerId, ownerId)))
    .orderBy(desc(attachments.createdAt), desc(attachments.id));
  return { rows: rows.map((r) => view({ ...r.a, uploadedByName: r.uploadedByName })) };
}

/** A signed, short-lived download link for an attachment of the team. */
export async function attachmentLink(teamId: string, id: string) {
  const a = await getAttachment(teamId, id);
  if (!a) return null;
  const { storageKey, ...meta } = a;
  return { ...meta, ...(await signedDownloadUrl(storageKey, a.fileName, a.contentType)) };
}

/** Removes an attachment (metadata first, then the object). */
export async function deleteAttachment(actor: Actor, id: string): Promise<boolean> {
  const a = await getAttachment(actor.teamId, id);
  if (!a) return false;
  const owner = await findOwner(actor.teamId, a.ownerType, a.ownerId);
  if (owner && !owner.open) throw closed();
  await db.transaction(async (tx) => {
    await tx.delete(attachments).where(and(eq(attachments.teamId, actor.teamId), eq(attachments.id, id)));
    await recordEvent(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "attachment.removed",
      entityType: a.ownerType,
      entityId: a.ownerId,
      summary: { before: { attachmentId: id, fileName: a.fileName } },
    });
  });
  await deleteObject(a.storageKey).catch((err: unknown) => console.error("[storage] could not delete", a.storageKey, err));
  return true;
}
