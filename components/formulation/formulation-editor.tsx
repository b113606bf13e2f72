"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useCallback, useMemo } from "react";
import { useForm, useWatch } from "react-hook-form";
import { ResultsView } from "@/components/results/results-view";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Panel } from "@/components/ui/panel";
import { plural, pluralWord } from "@/components/ui/plural";
import type { Revision } from "@/lib/client/formulations";
import type { Material } from "@/lib/formulation";
import { BasisFieldset } from "./basis-fieldset";
import { CoatFieldset } from "./coat-fieldset";
import { ComponentsFieldset } from "./components-fieldset";
import { EditorContext, type EditorContextValue } from "./editor-context";
import { blankValues, editorSchema, engineMaterial, valuesFromInput, type EditorValues } from "./editor-model";
import { fieldMessage } from "./editor-words";
import { FirstSteps } from "./first-steps";
import { MetaFields } from "./meta-fields";
import { ModifiersFieldset } from "./modifiers-fieldset";
import { ReagentsFieldset } from "./reagents-fieldset";
import { StepsFieldset } from "./steps-fieldset";
import { useDraftActions } from "./use-draft-actions";
import { useLiveResult } from "./use-live-result";

/** The part of a revision the editor works on. */
export type EditableRevision = Pick<Revision, "id" | "number" | "version" | "formulationId" | "formulationName" | "project" | "input">;

interface FormulationEditorProps {
  /** The team's library (for the pickers). */
  library: Material[];
  /** The draft being edited; absent for a new formulation. */
  revision?: EditableRevision;
  canSubmit: boolean;
}

/**
 * The formulation editor: a react-hook-form form whose values run through
 * the engine in the browser on every change; saving sends the input to the
 * server, which recomputes it and checks the version.
 */
export function FormulationEditor({ library, revision, canSubmit }: FormulationEditorProps) {
  const snapshot = useMemo(() => new Map((revision?.input.materials ?? []).map((m) => [m.id, m])), [revision]);
  const libraryById = useMemo(() => new Map(library.map((m) => [m.id, engineMaterial(m)])), [library]);
  const record = useCallback((id: string) => snapshot.get(id) ?? libraryById.get(id), [snapshot, libraryById]);
  const options = useMemo(() => {
    const extra = [...snapshot.values()].filter((m) => !libraryById.has(m.id)).map((m) => ({ ...m, name: `${m.name} (revision copy)` }));
    return [...libraryById.values(), ...extra].sort((a, b) => a.name.localeCompare(b.name));
  }, [snapshot, libraryById]);

  const defaults = useMemo(
    () =>
      revision
        ? valuesFromInput(revision.input, { name: revision.formulationName, project: revision.project })
        : blankValues([...libraryById.values()]),
    [revision, libraryById],
  );
  const form = useForm<EditorValues>({ resolver: zodResolver(editorSchema), defaultValues: defaults, mode: "onChange" });
  const { control, register, setValue, getValues, formState } = form;
  const values = useWatch({ control }) as EditorValues;
  const live = useLiveResult(values, record);
  const { version, flash, conflict, busy, serverMessages, onSave, onSubmitForReview, loadSaved } = useDraftActions(form, revision, live.input);

  const messageFor = useCallback(
    (field: string): string | undefined => {
      const own = field.split(".").reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], formState.errors) as
        | { message?: string }
        | undefined;
      return (own?.message ? fieldMessage(field, own.message) : undefined) ?? serverMessages[field] ?? live.messages[field];
    },
    [formState.errors, live.messages, serverMessages],
  );

  const ctx: EditorContextValue = { control, register, setValue, getValues, errors: formState.errors, messageFor, options, record, readOnly: false };

  const errorCount = Object.keys(live.messages).length;
  const title = revision ? `${revision.formulationName}, revision ${revision.number}` : "New formulation";

  return (
    <EditorContext.Provider value={ctx}>
      <form onSubmit={onSave} noValidate className="grid gap-4 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]" aria-label="Formulation editor">
        <div className="flex min-w-0 flex-col gap-3">
          <div className="sticky top-0 z-20 -mx-1 flex flex-wrap items-center gap-2 border-b border-rule bg-paper/95 px-1 py-2">
            <h1 className="mr-auto text-lg font-semibold">{title}</h1>
            <Button type="submit" variant={revision ? "secondary" : "primary"} busy={busy === "save"}>
              {revision ? (busy === "save" ? "Saving…" : "Save draft") : busy === "save" ? "Creating…" : "Create formulation"}
            </Button>
            {revision && canSubmit ? (
              <Button variant="primary" onClick={onSubmitForReview} busy={busy === "submit"}>
                Submit for review
              </Button>
            ) : null}
          </div>
          <div id="editor-messages" tabIndex={-1} aria-live="assertive" className="outline-none">
            {conflict ? (
              <Alert tone="fail" title="Not saved: someone else changed this draft">
                <p>{conflict}</p>
                <p className="mt-0.5">Your edits are still here. Copy what you need, then load the saved version.</p>
                <Button className="mt-2" onClick={loadSaved}>
                  Load the saved version (drops your edits)
                </Button>
              </Alert>
            ) : null}
            {flash ? <Alert tone={flash.tone === "error" ? "fail" : "clear"}>{flash.text}</Alert> : null}
          </div>
          <p className="text-xs text-muted" aria-live="polite">
            {formState.isDirty ? "Unsaved changes. " : revision ? `Saved, version ${version}. ` : ""}
            {errorCount > 0 ? `${plural(errorCount, "field")} ${pluralWord(errorCount, "needs", "need")} attention. ` : ""}
          </p>
          {!revision ? <MetaFields /> : (
            <p className="text-sm text-muted">
              {revision.project ?? "No project"} ·{" "}
              <Link className="text-accent underline" href={`/formulations/${revision.formulationId}`}>
                all revisions
              </Link>
            </p>
          )}
          <BasisFieldset />
          <ComponentsFieldset />
          <ModifiersFieldset />
          <ReagentsFieldset />
          <StepsFieldset />
          <CoatFieldset />
          {live.messages.general ? <ErrorPanel title="The engine cannot compute this" message={live.messages.general} /> : null}
        </div>
        <div className="flex min-w-0 flex-col gap-3">
          <div className="flex items-baseline justify-between">
            <h2 className="text-base font-semibold">Results</h2>
            <span className="num text-xs text-muted" data-testid="compute-time">
              recomputed in the browser in {live.ms.toFixed(1)} ms
            </span>
          </div>
          {live.result ? (
            <ResultsView input={live.input} result={live.result} />
          ) : live.empty ? (
            <FirstSteps isNew={!revision} />
          ) : (
            <Panel title="No results yet">
              <p className="text-sm" role="status" data-testid="engine-error">
                {live.error ? `The recipe cannot be computed yet. ${live.error}` : "Fill in the form to see the recipe."}
              </p>
              <p className="mt-1 text-xs text-muted">The field that causes it is marked on the left.</p>
            </Panel>
          )}
        </div>
      </form>
    </EditorContext.Provider>
  );
}
