"use client";

import { buttonClass } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { ImportKind } from "@/lib/enums";
import { importUrls } from "@/lib/client/imports";
import { IMPORT_KIND_HELP, IMPORT_KIND_LABELS } from "./import-words";
import type { ImportWizardState } from "./use-import-wizard";

interface KindStepProps {
  /** Kinds the viewer's role may import. */
  kinds: readonly ImportKind[];
  wizard: Pick<ImportWizardState, "kind" | "chooseKind" | "busy">;
}

/** Step 1: what the file holds, and the template to start from. */
export function KindStep({ kinds, wizard }: KindStepProps) {
  const { kind } = wizard;
  return (
    <Panel title="1. What to import" id="import-kind">
      <div className="flex flex-col gap-3">
        <fieldset className="flex flex-wrap gap-4">
          <legend className="sr-only">What the file holds</legend>
          {kinds.map((k) => (
            <label key={k} className="flex items-center gap-2 text-sm">
              <input type="radio" name="import-kind" value={k} checked={kind === k} disabled={wizard.busy} onChange={() => wizard.chooseKind(k)} />
              {IMPORT_KIND_LABELS[k]}
            </label>
          ))}
        </fieldset>
        <p className="text-sm text-muted">
          {IMPORT_KIND_HELP[kind]} Start from our template: it is filled with an example and its first sheet explains every column.
        </p>
        <div className="flex flex-wrap gap-2" role="group" aria-label="Download the template">
          <a href={importUrls.template(kind, "xlsx")} download className={buttonClass("secondary", "py-1")}>
            <span aria-hidden="true">↓</span>Template (.xlsx)
          </a>
          <a href={importUrls.template(kind, "csv")} download className={buttonClass("secondary", "py-1")}>
            <span aria-hidden="true">↓</span>Template (CSV)
          </a>
        </div>
      </div>
    </Panel>
  );
}
