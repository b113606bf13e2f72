"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { useForm, useWatch, type FieldPath } from "react-hook-form";
import { useSWRConfig } from "swr";
import { ResultsView } from "@/components/results/results-view";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import type { FormulationInput, Material } from "@/lib/formulation";
import { ApiRequestError, apiSend, errorMessage, fetcher } from "@/lib/client/fetcher";
import { BasisFieldset } from "./basis-fieldset";
import { ComponentsFieldset } from "./components-fieldset";
import { EditorContext, useEditor as useEditorFields, type EditorContextValue } from "./editor-context";
import { blankValues, editorSchema, engineMaterial, formFieldFor, valuesFromInput, type EditorValues } from "./editor-model";
import { ReagentsFieldset } from "./reagents-fieldset";
import { StepsFieldset } from "./steps-fieldset";
import { useLiveResult } from "./use-live-result";

export interface EditableRevision {
  id: string;
  number: number;
  version: number;
  formulationId: string;
  formulationName: string;
  project: string | null;
  input: FormulationInput;
}

interface FormulationEditorProps {
  /** The team's library (for the pickers). */
  library: Material[];
  /** The draft being edited; absent for a new formulation. */
  revision?: EditableRevision;
  canSubmit: boolean;
}

type Flash = { tone: "error" | "info"; text: string } | null;

/**
 * The formulation editor: a react-hook-form form whose values run through
 * the engine in the browser on every change; saving sends the input to the
 * server, which recomputes it and checks the version.
 */
export function FormulationEditor({ library, revision, canSubmit }: FormulationEditorProps) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const [version, setVersion] = useState(revision?.version ?? 0);
  const [flash, setFlash] = useState<Flash>(null);
  const [conflict, setConflict] = useState<string | null>(null);
  const [server, setServer] = useState<{ key: string; fields: Record<string, string> } | null>(null);
  const [busy, setBusy] = useState<"save" | "submit" | null>(null);

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
  const { control, register, setValue, getValues, formState, handleSubmit, reset } = form;
  const values = useWatch({ control }) as EditorValues;
  const live = useLiveResult(values, record);
  const inputKey = JSON.stringify(live.input);

  const messageFor = useCallback(
    (field: string): string | undefined => {
      const own = field.split(".").reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], formState.errors) as
        | { message?: string }
        | undefined;
      if (own?.message) return own.message;
      if (server && server.key === inputKey && server.fields[field]) return server.fields[field];
      return live.messages[field];
    },
    [formState.errors, live.messages, server, inputKey],
  );

  const ctx: EditorContextValue = { control, register, setValue, getValues, errors: formState.errors, messageFor, options, record, readOnly: false };

  function show(f: Flash) {
    setFlash(f);
    requestAnimationFrame(() => document.getElementById("editor-messages")?.focus());
  }

  function serverFields(err: ApiRequestError) {
    const fields: Record<string, string> = {};
    for (const [path, message] of Object.entries(err.fields)) {
      const p = path.replace(/^input\./, "");
      const { field, prefix } = formFieldFor(p, getValues(), live.input);
      if (field.startsWith("name") || field === "general") continue;
      fields[field] ??= `${prefix ?? ""}${message}`;
    }
    if (err.fields.name) form.setError("name", { message: err.fields.name });
    setServer({ key: inputKey, fields });
  }

  async function save(): Promise<boolean> {
    setConflict(null);
    setFlash(null);
    const input = live.input;
    try {
      if (!revision) {
        const v = getValues();
        const created = await apiSend<{ formulationId: string; revisionId: string }>("POST", "/api/formulations", {
          name: v.name.trim(),
          project: v.project.trim() || null,
          description: v.description.trim() || null,
          input,
        });
        await mutate((key) => typeof key === "string" && key.startsWith("/api/formulations"));
        router.push(`/revisions/${created.revisionId}/edit?created=1`);
        return true;
      }
      const saved = await apiSend<{ version: number; computeError: string | null }>("PUT", `/api/revisions/${revision.id}`, { version, input });
      setVersion(saved.version);
      reset(getValues(), { keepValues: true });
      await mutate(`/api/revisions/${revision.id}`);
      await mutate((key) => typeof key === "string" && key.startsWith("/api/formulations"));
      show({ tone: "info", text: saved.computeError ? `Saved (version ${saved.version}), but the recipe cannot be computed: ${saved.computeError}` : `Saved as version ${saved.version}.` });
      return true;
    } catch (err) {
      if (err instanceof ApiRequestError && err.status === 409) {
        setConflict(err.message);
        requestAnimationFrame(() => document.getElementById("editor-messages")?.focus());
      } else if (err instanceof ApiRequestError && err.status === 422) {
        serverFields(err);
        show({ tone: "error", text: `Not saved: ${err.message}` });
      } else {
        show({ tone: "error", text: `Not saved: ${errorMessage(err)}` });
      }
      return false;
    }
  }

  const onSave = handleSubmit(
    async () => {
      setBusy("save");
      await save();
      setBusy(null);
    },
    () => show({ tone: "error", text: "Not saved: correct the fields marked in red." }),
  );

  const onSubmitForReview = handleSubmit(
    async () => {
      if (!revision) return;
      setBusy("submit");
      const ok = !formState.isDirty || (await save());
      if (ok) {
        try {
          await apiSend("POST", `/api/revisions/${revision.id}/submit`, {});
          await mutate(`/api/revisions/${revision.id}`);
          router.push(`/revisions/${revision.id}?submitted=1`);
          router.refresh();
        } catch (err) {
          show({ tone: "error", text: `Not submitted: ${errorMessage(err)}` });
        }
      }
      setBusy(null);
    },
    () => show({ tone: "error", text: "Not submitted: correct the fields marked in red." }),
  );

  async function loadSaved() {
    if (!revision) return;
    try {
      const fresh = await fetcher<EditableRevision & { state: string }>(`/api/revisions/${revision.id}`);
      if (fresh.state !== "draft") {
        router.push(`/revisions/${revision.id}`);
        return;
      }
      reset(valuesFromInput(fresh.input, { name: revision.formulationName, project: revision.project }));
      setVersion(fresh.version);
      setConflict(null);
      show({ tone: "info", text: `Loaded the saved version ${fresh.version}.` });
    } catch (err) {
      show({ tone: "error", text: `Could not load the saved version: ${errorMessage(err)}` });
    }
  }

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
              <div role="alert" className="rounded border border-fail/50 bg-fail-soft px-3 py-2 text-sm">
                <p className="font-medium text-fail">Not saved: someone else changed this draft</p>
                <p className="mt-0.5">{conflict}</p>
                <p className="mt-0.5">Your edits are still here. Copy what you need, then load the saved version.</p>
                <Button className="mt-2" onClick={loadSaved}>
                  Load the saved version (drops your edits)
                </Button>
              </div>
            ) : null}
            {flash ? (
              <p
                role={flash.tone === "error" ? "alert" : "status"}
                className={`rounded border px-3 py-2 text-sm ${flash.tone === "error" ? "border-fail/50 bg-fail-soft text-fail" : "border-clear/40 bg-clear-soft text-clear"}`}
              >
                {flash.text}
              </p>
            ) : null}
          </div>
          <p className="text-xs text-muted" aria-live="polite">
            {formState.isDirty ? "Unsaved changes. " : revision ? `Saved, version ${version}. ` : ""}
            {errorCount > 0 ? `${errorCount} field${errorCount === 1 ? " needs" : "s need"} attention. ` : ""}
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
          <ReagentsFieldset />
          <StepsFieldset />
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
          ) : (
            <Panel title="No results yet">
              <p className="text-sm" role="status" data-testid="engine-error">
                {live.error ? `The recipe cannot be computed: ${live.error}` : "Fill in the form to see the recipe."}
              </p>
              <p className="mt-1 text-xs text-muted">The field that causes it is marked on the left.</p>
            </Panel>
          )}
        </div>
      </form>
    </EditorContext.Provider>
  );
}

/** Name, project and description of a new formulation. */
function MetaFields() {
  const { register, messageFor } = useEditorFields();
  const f = (name: FieldPath<EditorValues>) => ({
    id: `f-${name}`,
    "aria-invalid": messageFor(name) ? true : undefined,
    "aria-describedby": `f-${name}-error`,
    ...register(name),
  });
  return (
    <fieldset className="flex flex-col gap-3 rounded border border-rule bg-panel p-3">
      <legend className="px-1 text-sm font-semibold">Formulation</legend>
      <Field id="f-name" label="Name" error={messageFor("name")}>
        <input className={inputClass(!!messageFor("name"))} {...f("name")} />
      </Field>
      <Field id="f-project" label="Project" hint="optional" error={messageFor("project")}>
        <input className={inputClass()} {...f("project")} />
      </Field>
      <Field id="f-description" label="Description" hint="optional" error={messageFor("description")}>
        <textarea rows={2} className={inputClass()} {...f("description")} />
      </Field>
    </fieldset>
  );
}

