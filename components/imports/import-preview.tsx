"use client";

import type { RefObject } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { plural, pluralWord } from "@/components/ui/plural";
import { ThermalBadge } from "@/components/ui/status";
import type { ImportPreview as Preview, ImportPreviewProblem } from "@/lib/client/imports";
import type { ThermalStatus } from "@/lib/formulation";
import { ProblemsTable } from "./problems-table";
import { ProposalsTable } from "./proposals-table";
import type { ImportWizardState } from "./use-import-wizard";

interface ImportPreviewProps {
  preview: Preview;
  wizard: Pick<ImportWizardState, "accept" | "setAccept" | "confirm" | "discard" | "phase" | "busy">;
  /** The heading, focused when the preview appears. */
  headingRef: RefObject<HTMLHeadingElement | null>;
}

/** Step 3: what will be saved, every problem by sheet, row and column, and saving or discarding it. */
export function ImportPreview({ preview, wizard, headingRef }: ImportPreviewProps) {
  const errors = preview.problems.filter((p) => p.level === "error");
  const warnings = preview.problems.filter((p) => p.level === "warning");
  return (
    <section aria-labelledby="preview-title" className="flex flex-col gap-3 rounded border border-rule bg-panel p-3" data-testid="import-preview">
      <h2 id="preview-title" ref={headingRef} tabIndex={-1} className="text-sm font-semibold">
        3. Check what will be saved: {preview.fileName}
      </h2>
      <Verdict errors={errors} warnings={warnings} />
      <PreviewCounts preview={preview} />
      {preview.kind === "formulation" ? <ComputedLine computed={preview.computed} /> : null}
      {preview.problems.length > 0 ? <ProblemsTable problems={[...errors, ...warnings]} /> : null}
      {preview.materials.length > 0 ? (
        <details className="text-sm" open={preview.kind === "materials"}>
          <summary className="cursor-pointer font-semibold">
            Materials: {preview.counts.toLink} linked to the library, {preview.counts.toCreate} new
          </summary>
          <ProposalsTable materials={preview.materials} />
        </details>
      ) : null}
      <div className="flex flex-col gap-2 border-t border-rule pt-3">
        {errors.length === 0 && warnings.length > 0 ? (
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" className="mt-1" checked={wizard.accept} onChange={(e) => wizard.setAccept(e.target.checked)} />
            <span>I have read the {plural(warnings.length, "warning")} and want to save anyway.</span>
          </label>
        ) : null}
        <div className="flex flex-wrap gap-2">
          {errors.length === 0 ? (
            <Button variant="primary" onClick={wizard.confirm} busy={wizard.phase === "saving"} disabled={warnings.length > 0 && !wizard.accept}>
              {preview.kind === "formulation" ? "Save as a new formulation" : `Save ${plural(preview.counts.toCreate, "new material")}`}
            </Button>
          ) : null}
          <Button onClick={wizard.discard} disabled={wizard.busy}>
            {errors.length === 0 ? "Discard" : "Discard this preview"}
          </Button>
        </div>
      </div>
    </section>
  );
}

interface VerdictProps {
  errors: readonly ImportPreviewProblem[];
  warnings: readonly ImportPreviewProblem[];
}

/** Whether the file can be saved, in one line. */
function Verdict({ errors, warnings }: VerdictProps) {
  if (errors.length) {
    return (
      <Alert
        tone="fail"
        role="status"
        title={
          <>
            <span aria-hidden="true">✕ </span>
            {plural(errors.length, "error")}: nothing can be saved until {pluralWord(errors.length, "it is", "they are")} fixed in the file and the file is
            uploaded again.
          </>
        }
      />
    );
  }
  if (warnings.length) {
    return (
      <Alert
        tone="caution"
        title={
          <>
            <span aria-hidden="true">! </span>No errors; {plural(warnings.length, "warning")} to read and accept before saving.
          </>
        }
      />
    );
  }
  return (
    <Alert
      tone="clear"
      title={
        <>
          <span aria-hidden="true">✓ </span>No errors or warnings: ready to save.
        </>
      }
    />
  );
}

/** The figures of a preview: rows, materials, links, new ones, components and steps, errors and warnings. */
function PreviewCounts({ preview }: { preview: Preview }) {
  const c = preview.counts;
  const figures: [string, number][] = [
    ["Rows read", c.rows],
    ["Materials", c.materials],
    ["Linked to the library", c.toLink],
    ["New in the library", c.toCreate],
    ...(preview.kind === "formulation"
      ? ([
          ["Components", preview.counts.components],
          ["Process steps", preview.counts.steps],
        ] as [string, number][])
      : []),
    ["Errors", c.errors],
    ["Warnings", c.warnings],
  ];
  return (
    <dl className="num grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4" data-testid="import-counts">
      {preview.kind === "formulation" && preview.formulation.name ? (
        <div className="col-span-2 sm:col-span-4">
          <dt className="inline text-muted">Formulation: </dt>
          <dd className="inline font-medium">
            {preview.formulation.name}
            {preview.formulation.project ? <span className="font-normal text-muted"> · {preview.formulation.project}</span> : null}
          </dd>
        </div>
      ) : null}
      {figures.map(([label, n]) => (
        <div key={label} className="flex justify-between gap-2 border-b border-rule/60 py-0.5">
          <dt className="text-muted">{label}</dt>
          <dd className="font-medium">{n}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Whether the imported recipe computes, with its thermal check. */
function ComputedLine({ computed }: { computed: Extract<Preview, { kind: "formulation" }>["computed"] }) {
  // The preview types the status loosely (string); it is one of the engine's ThermalStatus values.
  const thermal = computed.thermalStatus as ThermalStatus | undefined;
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm">
      {computed.ok ? (
        <>
          The recipe computes.{thermal ? <ThermalBadge status={thermal} detail=" (thermal check)" /> : null}
        </>
      ) : (
        <span className="text-caution">The recipe does not compute yet ({computed.message ?? "see the problems"}); it can still be saved as a draft.</span>
      )}
    </p>
  );
}
