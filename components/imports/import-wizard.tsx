"use client";

import Link from "next/link";
import { useRef, useState, type FormEvent } from "react";
import { useSWRConfig } from "swr";
import { KIND_WORDS } from "@/components/results/words";
import { TD, TDN, TH } from "@/components/results/table";
import { Button, buttonClass } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ThermalBadge } from "@/components/ui/status";
import { fmtBytes, uploadWithProgress, type UploadProgress } from "@/components/ui/upload-request";
import type { MaterialKind, ThermalStatus } from "@/lib/formulation";
import { ApiRequestError, apiSend, errorMessage } from "@/lib/client/fetcher";

export type ImportKind = "formulation" | "materials";

/** Largest file the import reads, bytes (lib/spreadsheet/template.ts IMPORT_LIMITS). */
const MAX_BYTES = 5 * 1024 * 1024;

interface Problem {
  level: "error" | "warning";
  sheet: string;
  row: number | null;
  column: string | null;
  columnLetter: string | null;
  message: string;
}

interface Proposal {
  row: number | null;
  name: string;
  kind: MaterialKind;
  action: "link" | "create";
  id: string;
  matchedBy?: "name" | "casNumber";
  libraryName?: string;
}

/** The preview POST /api/imports answers with. */
interface Preview {
  id: string;
  kind: ImportKind;
  fileName: string;
  problems: Problem[];
  materials: Proposal[];
  counts: { rows: number; materials: number; toCreate: number; toLink: number; components?: number; steps?: number; errors: number; warnings: number };
  computed?: { ok: boolean; message?: string; thermalStatus?: string };
  formulation?: { name: string | null; project: string | null };
}

interface Outcome {
  outcome: { formulationId?: string; revisionId?: string; createdMaterials: { id: string; name: string }[]; linkedMaterials: { id: string; name: string }[] };
}

const KIND_LABELS: Record<ImportKind, string> = { formulation: "A formulation", materials: "Materials for the library" };

interface ImportWizardProps {
  /** Kinds the viewer's role may import. */
  kinds: ImportKind[];
  initialKind: ImportKind;
}

/** Choose a kind, fetch the template, upload, read every problem by sheet/row/column, accept warnings, save. */
export function ImportWizard({ kinds, initialKind }: ImportWizardProps) {
  const { mutate } = useSWRConfig();
  const [kind, setKind] = useState<ImportKind>(initialKind);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [phase, setPhase] = useState<"idle" | "uploading" | "checking" | "saving">("idle");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [accept, setAccept] = useState(false);
  const [message, setMessage] = useState<{ tone: "error" | "info"; text: string } | null>(null);
  const [saved, setSaved] = useState<{ preview: Preview; outcome: Outcome["outcome"] } | null>(null);
  const fileRef = useRef<HTMLInputElement | null>(null);
  const resultRef = useRef<HTMLHeadingElement | null>(null);

  function choose(f: File | null) {
    setFile(f);
    setMessage(null);
    if (!f) return setFileError(null);
    if (!/\.(xlsx|csv)$/i.test(f.name)) setFileError(`“${f.name}” is not a workbook (.xlsx) or a CSV file.`);
    else if (f.size > MAX_BYTES) setFileError(`“${f.name}” is ${fmtBytes(f.size)}; at most 5 MB is read.`);
    else setFileError(null);
  }

  async function upload(e: FormEvent) {
    e.preventDefault();
    setMessage(null);
    if (!file) {
      setFileError("Choose a file first.");
      fileRef.current?.focus();
      return;
    }
    if (fileError) {
      fileRef.current?.focus();
      return;
    }
    const form = new FormData();
    form.set("kind", kind);
    form.set("file", file);
    setSaved(null);
    setPhase("uploading");
    setProgress({ loaded: 0, total: file.size });
    try {
      const answer = await uploadWithProgress<Preview>("/api/imports", form, (p) => {
        setProgress(p);
        if (p.total && p.loaded >= p.total) setPhase("checking");
      });
      setPreview(answer);
      setAccept(false);
      setTimeout(() => resultRef.current?.focus(), 0);
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
      const done = await apiSend<Outcome>("POST", `/api/imports/${preview.id}/confirm`, { acceptWarnings: accept });
      setSaved({ preview, outcome: done.outcome });
      setPreview(null);
      setFile(null);
      if (fileRef.current) fileRef.current.value = "";
      await mutate((key) => typeof key === "string" && (key.startsWith("/api/materials") || key.startsWith("/api/formulations")));
      setTimeout(() => resultRef.current?.focus(), 0);
    } catch (err) {
      setMessage({ tone: "error", text: `Nothing was saved: ${errorMessage(err)}` });
    } finally {
      setPhase("idle");
    }
  }

  async function discard() {
    if (!preview) return;
    try {
      await apiSend("DELETE", `/api/imports/${preview.id}`);
    } catch {
      // Already gone or expired: nothing to keep anyway.
    }
    setPreview(null);
    setMessage({ tone: "info", text: "The preview was discarded; nothing was saved." });
  }

  const errors = preview?.problems.filter((p) => p.level === "error") ?? [];
  const warnings = preview?.problems.filter((p) => p.level === "warning") ?? [];
  const busy = phase !== "idle";
  const thermal = preview?.computed?.thermalStatus as ThermalStatus | undefined;

  return (
    <div className="flex flex-col gap-4">
      <Panel title="1. What to import" id="import-kind">
        <div className="flex flex-col gap-3">
          <fieldset className="flex flex-wrap gap-4">
            <legend className="sr-only">What the file holds</legend>
            {kinds.map((k) => (
              <label key={k} className="flex items-center gap-2 text-sm">
                <input
                  type="radio"
                  name="import-kind"
                  value={k}
                  checked={kind === k}
                  disabled={busy}
                  onChange={() => {
                    setKind(k);
                    setPreview(null);
                    setSaved(null);
                  }}
                />
                {KIND_LABELS[k]}
              </label>
            ))}
          </fieldset>
          <p className="text-sm text-muted">
            {kind === "formulation"
              ? "One formulation per file: its settings, components, process steps and the materials it uses. It is saved as a new formulation with a draft revision."
              : "Any number of materials as supplied, with the source of each value. Materials already in the library are linked, not changed; the others are added."}{" "}
            Start from our template: it is filled with an example and its first sheet explains every column.
          </p>
          <div className="flex flex-wrap gap-2" role="group" aria-label="Download the template">
            <a href={`/api/templates/${kind}?format=xlsx`} download className={buttonClass("secondary", "py-1")}>
              <span aria-hidden="true">↓</span>Template (.xlsx)
            </a>
            <a href={`/api/templates/${kind}?format=csv`} download className={buttonClass("secondary", "py-1")}>
              <span aria-hidden="true">↓</span>Template (CSV)
            </a>
          </div>
        </div>
      </Panel>

      <Panel title="2. Upload the file" id="import-upload">
        <form onSubmit={upload} className="flex flex-col gap-2" aria-label="Upload a file to import">
          <div className="grid gap-2 sm:grid-cols-[minmax(0,28rem)_auto] sm:items-start">
            <Field id="import-file" label="Workbook (.xlsx) or CSV file" hint="up to 5 MB, 5,000 rows per sheet, 20 sheets" error={fileError}>
              <input
                id="import-file"
                ref={fileRef}
                type="file"
                accept=".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv"
                className={inputClass(!!fileError, "py-1")}
                aria-invalid={fileError ? true : undefined}
                aria-describedby="import-file-error"
                disabled={busy}
                onChange={(e) => choose(e.target.files?.[0] ?? null)}
              />
            </Field>
            <div className="sm:pt-[1.4rem]">
              <Button type="submit" variant="primary" busy={phase === "uploading" || phase === "checking"}>
                {preview ? "Upload again and check" : "Upload and check"}
              </Button>
            </div>
          </div>
          <div aria-live="polite" className="text-sm">
            {phase === "uploading" && progress ? (
              <label className="flex items-center gap-2">
                <span>
                  Uploading {progress.total ? `${fmtBytes(progress.loaded)} of ${fmtBytes(progress.total)}` : "…"}
                </span>
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

      {preview ? (
        <section aria-labelledby="preview-title" className="flex flex-col gap-3 rounded border border-rule bg-panel p-3" data-testid="import-preview">
          <h2 id="preview-title" ref={resultRef} tabIndex={-1} className="text-sm font-semibold">
            3. Check what will be saved: {preview.fileName}
          </h2>
          <p role="status" className={`rounded border px-3 py-2 text-sm ${errors.length ? "border-fail/50 bg-fail-soft" : warnings.length ? "border-caution/50 bg-caution-soft" : "border-clear/40 bg-clear-soft"}`}>
            {errors.length ? (
              <strong className="text-fail">
                <span aria-hidden="true">✕ </span>
                {errors.length} error{errors.length === 1 ? "" : "s"}: nothing can be saved until {errors.length === 1 ? "it is" : "they are"} fixed in the file and the
                file is uploaded again.
              </strong>
            ) : warnings.length ? (
              <strong className="text-caution">
                <span aria-hidden="true">! </span>No errors; {warnings.length} warning{warnings.length === 1 ? "" : "s"} to read and accept before saving.
              </strong>
            ) : (
              <strong className="text-clear">
                <span aria-hidden="true">✓ </span>No errors or warnings: ready to save.
              </strong>
            )}
          </p>
          <dl className="num grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4" data-testid="import-counts">
            {preview.formulation?.name ? (
              <div className="col-span-2 sm:col-span-4">
                <dt className="inline text-muted">Formulation: </dt>
                <dd className="inline font-medium">
                  {preview.formulation.name}
                  {preview.formulation.project ? <span className="font-normal text-muted"> · {preview.formulation.project}</span> : null}
                </dd>
              </div>
            ) : null}
            {(
              [
                ["Rows read", preview.counts.rows],
                ["Materials", preview.counts.materials],
                ["Linked to the library", preview.counts.toLink],
                ["New in the library", preview.counts.toCreate],
                ...(preview.kind === "formulation"
                  ? ([
                      ["Components", preview.counts.components ?? 0],
                      ["Process steps", preview.counts.steps ?? 0],
                    ] as [string, number][])
                  : []),
                ["Errors", preview.counts.errors],
                ["Warnings", preview.counts.warnings],
              ] as [string, number][]
            ).map(([label, n]) => (
              <div key={label} className="flex justify-between gap-2 border-b border-rule/60 py-0.5">
                <dt className="text-muted">{label}</dt>
                <dd className="font-medium">{n}</dd>
              </div>
            ))}
          </dl>
          {preview.kind === "formulation" && preview.computed ? (
            <p className="flex flex-wrap items-center gap-2 text-sm">
              {preview.computed.ok ? (
                <>
                  The recipe computes.{thermal ? <ThermalBadge status={thermal} detail=" (thermal check)" /> : null}
                </>
              ) : (
                <span className="text-caution">The recipe does not compute yet ({preview.computed.message ?? "see the problems"}); it can still be saved as a draft.</span>
              )}
            </p>
          ) : null}

          {preview.problems.length > 0 ? (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="import-problems">
                <caption className="mb-1 text-left text-sm font-semibold">Problems, by where they are in the file</caption>
                <thead>
                  <tr className="border-b border-rule bg-paper">
                    <th scope="col" className={TH}>
                      Level
                    </th>
                    <th scope="col" className={TH}>
                      Sheet
                    </th>
                    <th scope="col" className={TH}>
                      Row
                    </th>
                    <th scope="col" className={TH}>
                      Column
                    </th>
                    <th scope="col" className={TH}>
                      What to do
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {[...errors, ...warnings].map((p, i) => (
                    <tr key={i} className="border-b border-rule/60 last:border-0">
                      <td className={TD}>
                        {p.level === "error" ? (
                          <span className="inline-flex items-center gap-1 rounded border border-fail/50 bg-fail-soft px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap text-fail">
                            <span aria-hidden="true">✕</span>Error
                          </span>
                        ) : (
                          <span className="inline-flex items-center gap-1 rounded border border-caution/50 bg-caution-soft px-1.5 py-0.5 text-xs font-medium whitespace-nowrap text-caution">
                            <span aria-hidden="true">!</span>Warning
                          </span>
                        )}
                      </td>
                      <td className={`${TD} whitespace-nowrap`}>{p.sheet}</td>
                      <td className={`${TDN} text-left`}>{p.row ?? "–"}</td>
                      <td className={TD}>
                        {p.column ? (
                          <>
                            <span className="num font-mono">{p.columnLetter}</span> <span className="text-muted">{p.column}</span>
                          </>
                        ) : (
                          "–"
                        )}
                      </td>
                      <td className={TD}>{p.message}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}

          {preview.materials.length > 0 ? (
            <details className="text-sm" open={preview.kind === "materials"}>
              <summary className="cursor-pointer font-semibold">
                Materials: {preview.counts.toLink} linked to the library, {preview.counts.toCreate} new
              </summary>
              <div className="mt-1 overflow-x-auto">
                <table className="w-full text-sm" data-testid="import-materials">
                  <caption className="sr-only">Materials in the file and what happens to each</caption>
                  <thead>
                    <tr className="border-b border-rule bg-paper">
                      <th scope="col" className={TH}>
                        Material
                      </th>
                      <th scope="col" className={TH}>
                        Kind
                      </th>
                      <th scope="col" className={TH}>
                        Row
                      </th>
                      <th scope="col" className={TH}>
                        On saving
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {preview.materials.map((m) => (
                      <tr key={`${m.id}-${m.name}`} className="border-b border-rule/60 last:border-0">
                        <td className={TD}>{m.name}</td>
                        <td className={TD}>{KIND_WORDS[m.kind] ?? m.kind}</td>
                        <td className={`${TD} num`}>{m.row ?? "–"}</td>
                        <td className={TD}>
                          {m.action === "link"
                            ? `Uses the library's “${m.libraryName ?? m.name}” (same ${m.matchedBy === "casNumber" ? "CAS number" : "name"})`
                            : "Added to the library"}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </details>
          ) : null}

          {errors.length === 0 ? (
            <div className="flex flex-col gap-2 border-t border-rule pt-3">
              {warnings.length > 0 ? (
                <label className="flex items-start gap-2 text-sm">
                  <input type="checkbox" className="mt-1" checked={accept} onChange={(e) => setAccept(e.target.checked)} />
                  <span>
                    I have read the {warnings.length} warning{warnings.length === 1 ? "" : "s"} and want to save anyway.
                  </span>
                </label>
              ) : null}
              <div className="flex flex-wrap gap-2">
                <Button variant="primary" onClick={confirm} busy={phase === "saving"} disabled={warnings.length > 0 && !accept}>
                  {preview.kind === "formulation" ? "Save as a new formulation" : `Save ${preview.counts.toCreate} new material${preview.counts.toCreate === 1 ? "" : "s"}`}
                </Button>
                <Button onClick={discard} disabled={busy}>
                  Discard
                </Button>
              </div>
            </div>
          ) : (
            <div className="flex flex-wrap gap-2 border-t border-rule pt-3">
              <Button onClick={discard} disabled={busy}>
                Discard this preview
              </Button>
            </div>
          )}
        </section>
      ) : null}

      <div aria-live="assertive">
        {message ? (
          <p role={message.tone === "error" ? "alert" : "status"} className={`rounded border px-3 py-2 text-sm ${message.tone === "error" ? "border-fail/50 bg-fail-soft text-fail" : "border-rule bg-panel text-ink"}`}>
            {message.text}
          </p>
        ) : null}
      </div>

      {saved ? (
        <section aria-labelledby="saved-title" className="rounded border border-clear/40 bg-clear-soft p-3 text-sm" data-testid="import-saved">
          <h2 id="saved-title" ref={resultRef} tabIndex={-1} className="font-semibold text-clear">
            <span aria-hidden="true">✓ </span>Saved from {saved.preview.fileName}
          </h2>
          {saved.outcome.formulationId ? (
            <p className="mt-1">
              New formulation “{saved.preview.formulation?.name}” with a draft revision.{" "}
              <Link href={`/formulations/${saved.outcome.formulationId}`} className="font-medium text-accent underline">
                Open the formulation
              </Link>
              {saved.outcome.revisionId ? (
                <>
                  {" · "}
                  <Link href={`/revisions/${saved.outcome.revisionId}`} className="font-medium text-accent underline">
                    Open revision 1
                  </Link>
                </>
              ) : null}
            </p>
          ) : null}
          <p className="mt-1">
            {saved.outcome.createdMaterials.length} material{saved.outcome.createdMaterials.length === 1 ? "" : "s"} added to the library
            {saved.outcome.createdMaterials.length ? ": " : "."}
            {saved.outcome.createdMaterials.map((m, i) => (
              <span key={m.id}>
                {i > 0 ? ", " : ""}
                <Link href={`/materials/${m.id}`} className="text-accent underline">
                  {m.name}
                </Link>
              </span>
            ))}
            {saved.outcome.linkedMaterials.length ? ` ${saved.outcome.linkedMaterials.length} linked to the library.` : ""}
          </p>
        </section>
      ) : null}
    </div>
  );
}
