"use client";

import { useId, useRef, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { fmtBytes, type UploadProgress } from "@/components/ui/upload-request";
import { deleteAttachment, uploadAttachment, useAttachments, type Attachment, type AttachmentKind } from "@/lib/client/attachments";
import { attachmentDownloadUrl } from "@/lib/client/downloads";
import { errorMessage } from "@/lib/client/fetcher";
import { fmtDateTime } from "@/lib/format";

/** Largest PDF accepted, bytes (the server checks the same: lib/uploads/pdf.ts). */
const MAX_BYTES = 10 * 1024 * 1024;

const ATTACHMENT_KIND_LABELS: Record<AttachmentKind, string> = {
  sds: "Safety data sheet",
  coa: "Certificate of analysis",
  other: "Other document",
};

interface AttachmentsPanelProps {
  ownerType: "material" | "batch" | "lot";
  ownerId: string;
  /** Whether the viewer may add and remove files (checked again by the server). */
  canChange: boolean;
  /** Why changes are not possible, when canChange is false and the reason is not the role. */
  readOnlyReason?: string;
  /** Kind preselected for a new upload. */
  defaultKind?: AttachmentKind;
  className?: string;
}

/** PDF documents kept with a material or a batch record: list, open, add, remove. */
export function AttachmentsPanel({ ownerType, ownerId, canChange, readOnlyReason, defaultKind = "sds", className = "" }: AttachmentsPanelProps) {
  const owner = { ownerType, ownerId };
  const { data, error, isLoading, mutate } = useAttachments(owner);
  const [kind, setKind] = useState<AttachmentKind>(defaultKind);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [confirmDialog, ask] = useConfirm();
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [message, setMessage] = useState<Outcome>(null);
  const fileRef = useRef<HTMLInputElement | null>(null);
  const base = useId();
  const fileId = `${base}-file`;
  const kindId = `${base}-kind`;

  function choose(f: File | null) {
    setFile(f);
    setMessage(null);
    if (!f) return setFileError(null);
    if (!/\.pdf$/i.test(f.name) && f.type !== "application/pdf") setFileError(`“${f.name}” is not a PDF. Upload the document as a PDF.`);
    else if (f.size > MAX_BYTES) setFileError(`“${f.name}” is ${fmtBytes(f.size)}; at most 10 MB is accepted.`);
    else setFileError(null);
  }

  async function upload(e: FormEvent) {
    e.preventDefault();
    if (!file) {
      setFileError("Choose a PDF file first.");
      return;
    }
    if (fileError) return;
    setProgress({ loaded: 0, total: file.size });
    setMessage(null);
    try {
      await uploadAttachment(owner, kind, file, setProgress);
      await mutate();
      setMessage({ tone: "info", text: `${ATTACHMENT_KIND_LABELS[kind]} “${file.name}” added.` });
      setFile(null);
      if (fileRef.current) fileRef.current.value = "";
    } catch (err) {
      setFileError(`Not added: ${errorMessage(err)}`);
    } finally {
      setProgress(null);
    }
  }

  async function remove(row: Attachment) {
    const confirmed = await ask({ title: `Remove “${row.fileName}”?`, message: "The file is deleted from storage; the history keeps a note that it was removed.", confirmLabel: "Remove the file" });
    if (!confirmed) return;
    try {
      await deleteAttachment(row.id);
      await mutate();
      setMessage({ tone: "info", text: `“${row.fileName}” removed.` });
    } catch (err) {
      setMessage({ tone: "error", text: `Not removed: ${errorMessage(err)}` });
    }
  }

  const rows = data?.rows ?? [];
  return (
    <Panel title="Documents" id={`${ownerType}-documents`} className={className} aside={<span className="text-xs text-muted">Safety data sheets, certificates of analysis · PDF, up to 10 MB</span>}>
      <div className="flex flex-col gap-3">
        {confirmDialog}
        {error ? <ErrorPanel title="Documents could not be loaded" message={error.message} onRetry={() => mutate()} /> : null}
        {isLoading && !data ? <TableSkeleton rows={2} label="Loading documents" /> : null}
        {data && rows.length === 0 ? <p className="text-sm text-muted">No documents yet.</p> : null}
        {rows.length > 0 ? (
          <ul className="divide-y divide-rule/70 rounded border border-rule" data-testid="attachments-list">
            {rows.map((row) => (
              <li key={row.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-1.5 text-sm">
                <span className="min-w-0">
                  <span className="block font-medium break-all">{row.fileName}</span>
                  <span className="num block text-xs text-muted">
                    {ATTACHMENT_KIND_LABELS[row.kind]} · {fmtBytes(row.sizeBytes)} · {row.uploadedByName ?? "someone"} · {fmtDateTime(row.createdAt)}
                  </span>
                </span>
                <span className="flex gap-2">
                  <a
                    href={attachmentDownloadUrl(row.id)}
                    target="_blank"
                    rel="noopener"
                    className="rounded border border-rule bg-panel px-3 py-1 text-sm font-medium"
                    aria-label={`Open ${row.fileName} (PDF, opens in a new tab)`}
                  >
                    Open
                  </a>
                  {canChange ? (
                    <Button variant="danger" className="py-1" onClick={() => remove(row)} aria-label={`Remove ${row.fileName}`}>
                      Remove
                    </Button>
                  ) : null}
                </span>
              </li>
            ))}
          </ul>
        ) : null}
        {canChange ? (
          <form onSubmit={upload} className="grid gap-2 sm:grid-cols-[12rem_minmax(0,1fr)_auto] sm:items-start" aria-label="Add a document">
            <Field id={kindId} label="Type">
              <select id={kindId} className={inputClass()} value={kind} onChange={(e) => setKind(e.target.value as AttachmentKind)}>
                {(Object.keys(ATTACHMENT_KIND_LABELS) as AttachmentKind[]).map((k) => (
                  <option key={k} value={k}>
                    {ATTACHMENT_KIND_LABELS[k]}
                  </option>
                ))}
              </select>
            </Field>
            <Field id={fileId} label="PDF file" hint="at most 10 MB" error={fileError}>
              <input
                id={fileId}
                ref={fileRef}
                type="file"
                accept="application/pdf,.pdf"
                className={inputClass(!!fileError, "py-1")}
                aria-invalid={fileError ? true : undefined}
                aria-describedby={`${fileId}-error`}
                onChange={(e) => choose(e.target.files?.[0] ?? null)}
              />
            </Field>
            <div className="flex flex-col gap-1 sm:pt-[1.4rem]">
              <Button type="submit" variant="primary" busy={progress !== null}>
                Add document
              </Button>
              {progress ? (
                <progress
                  className="h-2 w-full"
                  max={progress.total || undefined}
                  value={progress.total ? progress.loaded : undefined}
                  aria-label="Upload progress"
                />
              ) : null}
            </div>
          </form>
        ) : readOnlyReason ? (
          <p className="text-sm text-muted">{readOnlyReason}</p>
        ) : null}
        <OutcomeMessage outcome={message} />
      </div>
    </Panel>
  );
}
