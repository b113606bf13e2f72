"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { UseFormReturn } from "react-hook-form";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { createFormulation, fetchRevision, saveDraft, transitionRevision } from "@/lib/client/formulations";
import { useInvalidate } from "@/lib/client/invalidate";
import type { FormulationInput } from "@/lib/formulation";
import { formFieldFor, valuesFromInput, type EditorValues } from "./editor-model";
import { fieldMessage } from "./editor-words";
import type { EditableRevision } from "./formulation-editor";

/** A message above the form: a failure, or an outcome. */
export type Flash = { tone: "error" | "info"; text: string } | null;

/** Field messages the server sent for one input (dropped once the input changes). */
export interface ServerFields {
  key: string;
  fields: Record<string, string>;
}

const focusMessages = () => requestAnimationFrame(() => document.getElementById("editor-messages")?.focus());

/**
 * Saving, submitting and reloading a draft: the calls, the version kept for
 * the next save, and the messages they leave (a conflict, a flash, field
 * messages from the server).
 */
export function useDraftActions(form: UseFormReturn<EditorValues>, revision: EditableRevision | undefined, input: FormulationInput) {
  const router = useRouter();
  const invalidate = useInvalidate();
  const [version, setVersion] = useState(revision?.version ?? 0);
  const [flash, setFlash] = useState<Flash>(null);
  const [conflict, setConflict] = useState<string | null>(null);
  const [server, setServer] = useState<ServerFields | null>(null);
  const [busy, setBusy] = useState<"save" | "submit" | null>(null);
  const { getValues, reset, handleSubmit, formState } = form;
  const inputKey = JSON.stringify(input);

  function show(f: Flash) {
    setFlash(f);
    focusMessages();
  }

  function serverFields(err: ApiRequestError) {
    const fields: Record<string, string> = {};
    for (const [path, message] of Object.entries(err.fields)) {
      const { field, prefix } = formFieldFor(path.replace(/^input\./, ""), getValues(), input);
      if (field.startsWith("name") || field === "general") continue;
      fields[field] ??= prefix ? `${prefix}${message}` : fieldMessage(field, message);
    }
    if (err.fields.name) form.setError("name", { message: err.fields.name });
    setServer({ key: inputKey, fields });
  }

  async function save(): Promise<boolean> {
    setConflict(null);
    setFlash(null);
    try {
      if (!revision) {
        const v = getValues();
        const created = await createFormulation({
          name: v.name.trim(),
          project: v.project.trim() || null,
          description: v.description.trim() || null,
          input,
        });
        await invalidate("formulations");
        router.push(`/revisions/${created.revisionId}/edit?created=1`);
        return true;
      }
      const saved = await saveDraft(revision.id, { version, input });
      setVersion(saved.version);
      reset(getValues(), { keepValues: true });
      await invalidate("revisions", "formulations");
      show({ tone: "info", text: saved.computeError ? `Saved (version ${saved.version}), but the recipe cannot be computed: ${saved.computeError}` : `Saved as version ${saved.version}.` });
      return true;
    } catch (err) {
      if (err instanceof ApiRequestError && err.status === 409) {
        setConflict(err.message);
        focusMessages();
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
          await transitionRevision(revision.id, "submit");
          await invalidate("revisions", "formulations");
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
      const fresh = await fetchRevision(revision.id);
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

  const serverMessages = server && server.key === inputKey ? server.fields : {};
  return { version, flash, conflict, busy, serverMessages, onSave, onSubmitForReview, loadSaved };
}
