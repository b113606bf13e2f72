"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ToneBadge } from "@/components/ui/tone-badge";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { acknowledgeResult, enterResult, useBatchResults, type BatchResult } from "@/lib/client/quality";
import { fmtDateTime } from "@/lib/format";
import { limitWords, showNumber } from "./spec-words";

interface ResultsPanelProps {
  batchId: string;
  /** May enter results (batch:qc). */
  canEnter: boolean;
  /** May acknowledge an out-of-specification result (batch:dispose). */
  canAcknowledge: boolean;
}

/** Test results of a batch against its revision's specifications: one table per specification, the entry form, acknowledgement. */
export function ResultsPanel({ batchId, canEnter, canAcknowledge }: ResultsPanelProps) {
  const { data, error, mutate } = useBatchResults(batchId);
  const [specId, setSpecId] = useState("");
  const [value, setValue] = useState("");
  const [instrument, setInstrument] = useState("");
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (error) return <ErrorPanel title="Could not read the test results" message={error.message} onRetry={() => mutate()} />;
  if (!data) return <Panel title="Tests and results" id="results"><p className="text-sm text-muted">Loading the test results…</p></Panel>;
  const specs = data.specifications;
  const chosen = specs.find((s) => s.id === (specId || specs[0]?.id));
  const disposed = data.disposition !== null;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!chosen) return;
    setBusy(true);
    setFieldErrors({});
    setFormError(null);
    const trimmed = value.trim();
    const asNumber = Number(trimmed);
    // A numeric specification gets a number; anything else goes as text and the server names the field.
    const sent = chosen.numeric && trimmed !== "" && Number.isFinite(asNumber) ? asNumber : trimmed;
    try {
      await enterResult(batchId, { specId: chosen.id, value: sent, instrument: instrument.trim() || null });
      setValue("");
      await mutate();
    } catch (err) {
      if (err instanceof ApiRequestError && Object.keys(err.fields).length) setFieldErrors(err.fields);
      else setFormError(errorMessage(err));
    } finally {
      setBusy(false);
    }
  }

  return (
    <Panel title="Tests and results" id="results">
      {specs.length === 0 ? (
        <p className="text-sm text-muted">This revision has no test specifications.</p>
      ) : (
        <div className="flex flex-col gap-4">
          {specs.map((s) => (
            <SpecResults
              key={s.id}
              property={s.property}
              method={s.method}
              limits={limitWords(s)}
              unit={s.unit}
              results={data.results.filter((r) => r.specId === s.id)}
              canAcknowledge={canAcknowledge && !disposed}
              onChanged={() => mutate()}
              batchId={batchId}
            />
          ))}
          {disposed ? (
            <p className="text-sm text-muted">This batch was {data.disposition!.replaceAll("_", " ")}: its results can no longer change.</p>
          ) : canEnter ? (
            <form onSubmit={submit} className="flex flex-wrap items-end gap-3" aria-label="Enter a test result" noValidate>
              <Field id="result-spec" label="Test">
                <select id="result-spec" className={inputClass()} value={chosen?.id ?? ""} onChange={(e) => setSpecId(e.target.value)}>
                  {specs.map((s) => (
                    <option key={s.id} value={s.id}>
                      {s.property}
                    </option>
                  ))}
                </select>
              </Field>
              <Field id="result-value" label="Result" hint={chosen?.numeric ? chosen.unit : "text"} error={fieldErrors.value ?? fieldErrors.specId}>
                <input
                  id="result-value"
                  className={inputClass(!!fieldErrors.value)}
                  value={value}
                  onChange={(e) => setValue(e.target.value)}
                  inputMode={chosen?.numeric ? "decimal" : "text"}
                  aria-invalid={!!fieldErrors.value}
                  aria-describedby="result-value-error"
                />
              </Field>
              <Field id="result-instrument" label="Instrument" hint="optional" error={fieldErrors.instrument}>
                <input id="result-instrument" className={inputClass(!!fieldErrors.instrument)} value={instrument} onChange={(e) => setInstrument(e.target.value)} />
              </Field>
              <Button type="submit" variant="primary" busy={busy}>
                Enter result
              </Button>
              {formError ? <p className="w-full text-sm text-fail" role="alert">{formError}</p> : null}
            </form>
          ) : null}
        </div>
      )}
    </Panel>
  );
}

interface SpecResultsProps {
  batchId: string;
  property: string;
  method: string;
  limits: string;
  unit: string;
  results: BatchResult[];
  canAcknowledge: boolean;
  onChanged: () => void;
}

function SpecResults({ batchId, property, method, limits, unit, results, canAcknowledge, onChanged }: SpecResultsProps) {
  return (
    <table className="w-full text-sm" data-testid={`results-${property}`}>
      <caption className="mb-1 text-left">
        <span className="font-semibold">{property}</span> <span className="text-muted">· limits {limits}{method ? ` · ${method}` : ""}</span>
      </caption>
      <thead>
        <tr className="border-b border-rule text-left text-xs text-muted">
          <th className="px-2 py-1 font-medium">Result</th>
          <th className="px-2 py-1 font-medium">Instrument</th>
          <th className="px-2 py-1 font-medium">Entered</th>
          <th className="px-2 py-1 font-medium">Status</th>
        </tr>
      </thead>
      <tbody>
        {results.length === 0 ? (
          <tr>
            <td colSpan={4} className="px-2 py-1 text-muted">No result yet.</td>
          </tr>
        ) : (
          results.map((r) => (
            <tr key={r.id} className="border-b border-rule/60 align-top">
              <td className="num px-2 py-1">{r.valueNumber !== null ? `${showNumber(r.valueNumber)} ${unit}` : r.valueText}</td>
              <td className="px-2 py-1">{r.instrument ?? "—"}</td>
              <td className="num px-2 py-1 text-xs">
                {r.enteredByName ?? "unknown"} · {fmtDateTime(r.enteredAt)}
              </td>
              <td className="px-2 py-1">
                {r.outOfSpec ? (
                  <div className="flex flex-col gap-1">
                    <ToneBadge tone="fail" mark="✕">Out of specification</ToneBadge>
                    {r.acknowledgedAt ? (
                      <span className="text-xs">
                        Acknowledged by {r.acknowledgedByName ?? "unknown"}: {r.acknowledgement}
                      </span>
                    ) : canAcknowledge ? (
                      <Acknowledge batchId={batchId} resultId={r.id} onDone={onChanged} />
                    ) : (
                      <span className="text-xs text-muted">Waiting for a reviewer to acknowledge it.</span>
                    )}
                  </div>
                ) : (
                  <ToneBadge tone="clear" mark="✓">Within specification</ToneBadge>
                )}
              </td>
            </tr>
          ))
        )}
      </tbody>
    </table>
  );
}

function Acknowledge({ batchId, resultId, onDone }: { batchId: string; resultId: string; onDone: () => void }) {
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState("");
  const [err, setErr] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!open) return <Button onClick={() => setOpen(true)}>Acknowledge…</Button>;
  const id = `ack-${resultId}`;
  return (
    <form
      className="flex flex-col gap-1"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setErr(null);
        try {
          await acknowledgeResult(batchId, resultId, note);
          onDone();
        } catch (error) {
          setErr(error instanceof ApiRequestError && error.fields.note ? error.fields.note : errorMessage(error));
        } finally {
          setBusy(false);
        }
      }}
    >
      <Field id={id} label="Why is this result acceptable?" error={err}>
        <textarea id={id} className={inputClass(!!err)} rows={2} value={note} onChange={(e) => setNote(e.target.value)} />
      </Field>
      <Button type="submit" variant="primary" busy={busy}>
        Acknowledge
      </Button>
    </form>
  );
}
