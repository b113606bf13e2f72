"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { ApiRequestError, apiSend, errorMessage } from "@/lib/client/fetcher";
import { EXPLORATION_NAME_MAX, type ExplorationBody } from "@/lib/explore/spec";

interface SavePanelProps {
  formulationId: string;
  /** The body to save, without its name; null until a run is shown. */
  body: Omit<ExplorationBody, "name"> | null;
  defaultName: string;
  /** Called with the saved exploration's id. */
  onSaved: (id: string) => void;
  savedId: string | null;
}

/** Saves the shown run's setup, search and candidates with the formulation (the revision does not change). */
export function SavePanel({ formulationId, body, defaultName, onSaved, savedId }: SavePanelProps) {
  const [name, setName] = useState(defaultName);
  const [busy, setBusy] = useState(false);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);

  async function save() {
    if (!body) return;
    setBusy(true);
    setFields({});
    setMessage(null);
    try {
      const made = await apiSend<{ id: string }>("POST", `/api/formulations/${formulationId}/explorations`, { ...body, name });
      onSaved(made.id);
    } catch (err) {
      if (err instanceof ApiRequestError && err.status === 422) {
        setFields(err.fields);
        setMessage(err.fields.name ? null : Object.entries(err.fields).map(([k, v]) => `${k}: ${v}`).join("; ") || err.message);
      } else {
        setMessage(errorMessage(err));
      }
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-3">
        <Field id="x-save-name" label="Name of the exploration" error={fields.name} className="w-80">
          <input
            id="x-save-name"
            className={inputClass(!!fields.name)}
            maxLength={EXPLORATION_NAME_MAX + 20}
            value={name}
            onChange={(e) => setName(e.target.value)}
            aria-invalid={fields.name ? true : undefined}
            aria-describedby="x-save-name-error"
          />
        </Field>
        <Button variant="primary" onClick={save} busy={busy} disabled={!body}>
          Save the exploration
        </Button>
      </div>
      {!body ? <p className="text-[13px] text-muted">Run the exploration first; Save keeps what is shown.</p> : null}
      <p aria-live="polite" className="text-sm" data-testid="save-state">
        {message ? <span className="text-fail">{message}</span> : null}
        {savedId && !message ? (
          <>
            Saved with the formulation.{" "}
            <Link className="text-accent underline" href={`/formulations/${formulationId}/explore?exploration=${savedId}`}>
              Open the saved exploration
            </Link>
          </>
        ) : null}
      </p>
    </div>
  );
}
