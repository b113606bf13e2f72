"use client";

import { Alert } from "@/components/ui/alert";
import type { ImportKind } from "@/lib/enums";
import { ImportPreview } from "./import-preview";
import { ImportSaved } from "./import-saved";
import { KindStep } from "./kind-step";
import { UploadStep } from "./upload-step";
import { useImportWizard } from "./use-import-wizard";

interface ImportWizardProps {
  /** Kinds the viewer's role may import. */
  kinds: readonly ImportKind[];
  initialKind: ImportKind;
}

/**
 * Choose a kind, fetch the template, upload, read every problem by
 * sheet/row/column, accept warnings, save. The state and the calls to the
 * server live in useImportWizard; each step is its own part.
 */
export function ImportWizard({ kinds, initialKind }: ImportWizardProps) {
  const wizard = useImportWizard(initialKind);
  const { preview, message, saved } = wizard;
  return (
    <div className="flex flex-col gap-4">
      <KindStep kinds={kinds} wizard={wizard} />
      <UploadStep wizard={wizard} fileRef={wizard.fileRef} />
      {preview ? <ImportPreview preview={preview} wizard={wizard} headingRef={wizard.resultRef} /> : null}
      <div aria-live="assertive">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      {saved ? <ImportSaved saved={saved} headingRef={wizard.resultRef} /> : null}
    </div>
  );
}
