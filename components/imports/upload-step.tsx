"use client";

import type { RefObject } from "react";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { fmtBytes } from "@/components/ui/upload-request";
import { UPLOAD_LIMIT_WORDS } from "./import-words";
import type { ImportWizardState } from "./use-import-wizard";

interface UploadStepProps {
  wizard: Pick<ImportWizardState, "upload" | "fileError" | "busy" | "chooseFile" | "phase" | "preview" | "progress">;
  /** The file field, focused when the file cannot be sent. */
  fileRef: RefObject<HTMLInputElement | null>;
}

/** Step 2: choose the file and send it; how far the upload and the check have come. */
export function UploadStep({ wizard, fileRef }: UploadStepProps) {
  const { fileError, phase, progress } = wizard;
  return (
    <Panel title="2. Upload the file" id="import-upload">
      <form onSubmit={wizard.upload} className="flex flex-col gap-2" aria-label="Upload a file to import">
        <div className="grid gap-2 sm:grid-cols-[minmax(0,28rem)_auto] sm:items-start">
          <Field id="import-file" label="Workbook (.xlsx) or CSV file" hint={UPLOAD_LIMIT_WORDS} error={fileError}>
            <input
              id="import-file"
              ref={fileRef}
              type="file"
              accept=".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv"
              className={inputClass(!!fileError, "py-1")}
              aria-invalid={fileError ? true : undefined}
              aria-describedby="import-file-error"
              disabled={wizard.busy}
              onChange={(e) => wizard.chooseFile(e.target.files?.[0] ?? null)}
            />
          </Field>
          <div className="sm:pt-[1.4rem]">
            <Button type="submit" variant="primary" busy={phase === "uploading" || phase === "checking"}>
              {wizard.preview ? "Upload again and check" : "Upload and check"}
            </Button>
          </div>
        </div>
        <div aria-live="polite" className="text-sm">
          {phase === "uploading" && progress ? (
            <label className="flex items-center gap-2">
              <span>Uploading {progress.total ? `${fmtBytes(progress.loaded)} of ${fmtBytes(progress.total)}` : "…"}</span>
              <progress className="h-2 w-48" max={progress.total || undefined} value={progress.total ? progress.loaded : undefined} />
            </label>
          ) : null}
          {phase === "checking" ? (
            <label className="flex items-center gap-2">
              <span>Checking every sheet, row and cell…</span>
              <progress className="h-2 w-48" />
            </label>
          ) : null}
        </div>
      </form>
    </Panel>
  );
}
