import useSWR from "swr";
import { uploadWithProgress, type UploadProgress } from "@/components/ui/upload-request";
import type { listAttachments } from "@/db/queries/attachments";
import { apiSend, fetcher, query } from "./fetcher";
import type { ApiData } from "./json";

/** A PDF kept with a material or a batch record, as GET /api/attachments sends it. */
export type Attachment = ApiData<typeof listAttachments>["rows"][number];
/** What an attachment is: a safety data sheet, a certificate of analysis, or another document. */
export type AttachmentKind = Attachment["kind"];

/** The record a document belongs to. */
export interface AttachmentOwner {
  ownerType: "material" | "batch" | "lot";
  ownerId: string;
}

/** The documents of one material or batch record, newest first. */
export function useAttachments(owner: AttachmentOwner) {
  return useSWR<{ rows: Attachment[] }>(`/api/attachments${query({ ownerType: owner.ownerType, ownerId: owner.ownerId })}`, fetcher);
}

/** Uploads a PDF for an owner, reporting progress. */
export function uploadAttachment(owner: AttachmentOwner, kind: AttachmentKind, file: File, onProgress: (p: UploadProgress) => void) {
  const form = new FormData();
  form.set("ownerType", owner.ownerType);
  form.set("ownerId", owner.ownerId);
  form.set("kind", kind);
  form.set("file", file);
  return uploadWithProgress("/api/attachments", form, onProgress);
}

/** Removes a document (the history keeps a note of it). */
export function deleteAttachment(id: string) {
  return apiSend("DELETE", `/api/attachments/${id}`);
}
