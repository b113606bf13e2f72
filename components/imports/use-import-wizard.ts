"use client";

import { useRef, useState, type FormEvent } from "react";
import type { UploadProgress } from "@/components/ui/upload-request";
import type { ImportKind } from "@/lib/enums";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { confirmImport, createdIds, discardImport, uploadImport, type ImportPreview } from "@/lib/client/imports";
import { useInvalidate } from "@/lib/client/invalidate";
import { fileProblem } from "./import-words";

/** Where the wizard is: waiting, sending the file, the server checking it, or saving. */
export type ImportPhase = "idle" | "uploading" | "checking" | "saving";

/** A preview that was saved, with what saving created. */
export interface SavedImport {
  preview: ImportPreview;
  formulationId?: string;
  revisionId?: string;
}

/**
 * The import wizard's state and steps: the kind, the chosen file and why it
 * cannot be sent, upload progress, the preview, accepting its warnings, and
 * the outcome of saving or discarding. Focus moves to the preview or the
 * outcome when it appears, and back to the file field on a problem.
 */
export function useImportWizard(initialKind: ImportKind) {
  const invalidate = useInvalidate();
  const [kind, setKind] = useState<ImportKind>(initialKind);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [phase, setPhase] = useState<ImportPhase>("idle");
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [accept, setAccept] = useState(false);
  const [message, setMessage] = useState<{ tone: "fail" | "info"; text: string } | null>(null);
  const [saved, setSaved] = useState<SavedImport | null>(null);
  const fileRef = useRef<HTMLInputElement | null>(null);
  const resultRef = useRef<HTMLHeadingElement | null>(null);
  const focusResult = () => setTimeout(() => resultRef.current?.focus(), 0);

  function chooseKind(k: ImportKind) {
    setKind(k);
    setPreview(null);
    setSaved(null);
  }

  function chooseFile(f: File | null) {
    setFile(f);
    setMessage(null);
    setFileError(f ? fileProblem(f) : null);
  }

  async function upload(e: FormEvent) {
    e.preventDefault();
    setMessage(null);
    if (!file || fileError) {
      if (!file) setFileError("Choose a file first.");
      fileRef.current?.focus();
      return;
    }
    setSaved(null);
    setPhase("uploading");
    setProgress({ loaded: 0, total: file.size });
    try {
      const answer = await uploadImport(kind, file, (p) => {
        setProgress(p);
        if (p.total && p.loaded >= p.total) setPhase("checking");
      });
      setPreview(answer);
      setAccept(false);
      focusResult();
    } catch (err) {
      const fieldMessage = err instanceof ApiRequestError ? (err.fields.file ?? err.fields.kind) : undefined;
      setFileError(`Not read: ${fieldMessage ?? errorMessage(err)}`);
      fileRef.current?.focus();
    } finally {
      setPhase("idle");
      setProgress(null);
    }
  }

  async function confirm() {
    if (!preview) return;
    setPhase("saving");
    setMessage(null);
    try {
      const done = await confirmImport(preview.id, accept);
      setSaved({ preview, ...createdIds(done) });
      setPreview(null);
      setFile(null);
      if (fileRef.current) fileRef.current.value = "";
      await invalidate("materials", "formulations");
      focusResult();
    } catch (err) {
      setMessage({ tone: "fail", text: `Nothing was saved: ${errorMessage(err)}` });
    } finally {
      setPhase("idle");
    }
  }

  async function discard() {
    if (!preview) return;
    try {
      await discardImport(preview.id);
    } catch {
      // Already gone or expired: nothing to keep anyway.
    }
    setPreview(null);
    setMessage({ tone: "info", text: "The preview was discarded; nothing was saved." });
  }

  return { kind, chooseKind, file, chooseFile, fileError, fileRef, progress, phase, busy: phase !== "idle", upload, preview, accept, setAccept, confirm, discard, message, saved, resultRef };
}

/** Everything the wizard's parts read from useImportWizard. */
export type ImportWizardState = ReturnType<typeof useImportWizard>;
