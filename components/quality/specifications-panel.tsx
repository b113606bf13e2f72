"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { inputClass } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { saveSpecifications, useSpecifications } from "@/lib/client/quality";
import type { FormulationResult } from "@/lib/formulation";
import { proposedSpecifications } from "@/lib/quality/proposed-specs";
import type { Specification } from "@/lib/quality/specification";
import { limitWords, showNumber } from "./spec-words";

interface SpecificationsPanelProps {
  revisionId: string;
  /** The revision is a draft and the viewer may change it. */
  editable: boolean;
  /** The revision's result, for the proposed specifications. */
  result: FormulationResult | null;
  /** Called after a save (the revision's version moved on). */
  onSaved?: () => void;
}

/** Text of a number field as typed; "" is no value. */
type Row = Omit<Specification, "target" | "lower" | "upper"> & { target: string; lower: string; upper: string };

const toRow = (s: Specification): Row => ({
  ...s,
  target: s.target === null ? "" : String(Number(s.target.toPrecision(6))),
  lower: s.lower === null ? "" : String(Number(s.lower.toPrecision(6))),
  upper: s.upper === null ? "" : String(Number(s.upper.toPrecision(6))),
});

/** A typed number, or the text itself so the server names the field. */
function num(text: string): number | null {
  const t = text.trim();
  if (t === "") return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : (t as unknown as number);
}

/** "Tests and limits": the revision's specifications; editable while it is a draft, read-only after. */
export function SpecificationsPanel({ revisionId, editable, result, onSaved }: SpecificationsPanelProps) {
  const { data, error, mutate } = useSpecifications(revisionId);
  const [rows, setRows] = useState<Row[] | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (error) return <ErrorPanel title="Could not read the tests and limits" message={error.message} onRetry={() => mutate()} />;
  if (!data) return <Panel title="Tests and limits" id="specifications"><p className="text-sm text-muted">Loading…</p></Panel>;
  const current = rows ?? data.specifications.map(toRow);
  const change = (i: number, patch: Partial<Row>) => setRows(current.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  async function save() {
    setBusy(true);
    setFields({});
    setMessage(null);
    try {
      const specs = current.map((r) => ({
        ...r,
        target: r.numeric ? num(r.target) : null,
        lower: r.numeric ? num(r.lower) : null,
        upper: r.numeric ? num(r.upper) : null,
        requirement: r.numeric ? null : r.requirement || null,
      }));
      await saveSpecifications(revisionId, specs, data!.version);
      setRows(null);
      await mutate();
      setMessage("Saved.");
      onSaved?.();
    } catch (err) {
      if (err instanceof ApiRequestError) setFields(err.fields);
      setMessage(errorMessage(err));
    } finally {
      setBusy(false);
    }
  }

  if (!editable) {
    return (
      <Panel title="Tests and limits" id="specifications">
        {data.specifications.length === 0 ? (
          <p className="text-sm text-muted">No test specifications.</p>
        ) : (
          <table className="w-full text-sm" data-testid="specifications">
            <thead>
              <tr className="border-b border-rule text-left text-xs text-muted">
                <th className="px-2 py-1 font-medium">Property</th>
                <th className="px-2 py-1 font-medium">Method</th>
                <th className="px-2 py-1 font-medium">Target</th>
                <th className="px-2 py-1 font-medium">Limits</th>
              </tr>
            </thead>
            <tbody>
              {data.specifications.map((s) => (
                <tr key={s.id} className="border-b border-rule/60 align-top">
                  <td className="px-2 py-1 font-medium">{s.property}</td>
                  <td className="px-2 py-1">{s.method || "—"}</td>
                  <td className="num px-2 py-1">{s.numeric ? `${showNumber(s.target)} ${s.unit}` : "—"}</td>
                  <td className="num px-2 py-1">{limitWords(s)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    );
  }

  const have = new Set(current.map((r) => r.property));
  const proposals = proposedSpecifications(result).filter((s) => !have.has(s.property));
  const err = (i: number, f: string) => fields[`specifications.${i}.${f}`];
  return (
    <Panel title="Tests and limits" id="specifications">
      <p className="mb-2 text-xs text-muted">
        What production measures on each batch. Proposed limits are ±10 % of the computed value (common practice, no source): adjust them. They are approved with the revision and cannot change after it is submitted.
      </p>
      <div className="flex flex-col gap-3">
        {current.map((r, i) => (
          <fieldset key={r.id} className="grid grid-cols-2 gap-2 rounded border border-rule p-2 md:grid-cols-8" aria-label={`Specification ${i + 1}`}>
            <label className="col-span-2 flex flex-col text-xs">
              Property
              <input className={inputClass(!!err(i, "property"))} value={r.property} onChange={(e) => change(i, { property: e.target.value })} />
              {err(i, "property") ? <span className="text-fail">{err(i, "property")}</span> : null}
            </label>
            <label className="col-span-2 flex flex-col text-xs">
              Method
              <input className={inputClass()} value={r.method} onChange={(e) => change(i, { method: e.target.value })} />
            </label>
            <label className="flex items-center gap-1 text-xs">
              <input type="checkbox" checked={r.numeric} onChange={(e) => change(i, { numeric: e.target.checked })} /> numeric
            </label>
            {r.numeric ? (
              <>
                <label className="flex flex-col text-xs">
                  Unit
                  <input className={inputClass()} value={r.unit} onChange={(e) => change(i, { unit: e.target.value })} />
                </label>
                {(["target", "lower", "upper"] as const).map((f) => (
                  <label key={f} className="flex flex-col text-xs">
                    {f === "target" ? "Target" : f === "lower" ? "Lower limit" : "Upper limit"}
                    <input className={inputClass(!!err(i, f))} inputMode="decimal" value={r[f]} onChange={(e) => change(i, { [f]: e.target.value })} />
                    {err(i, f) ? <span className="text-fail">{err(i, f)}</span> : null}
                  </label>
                ))}
              </>
            ) : (
              <label className="col-span-2 flex flex-col text-xs">
                Requirement
                <input className={inputClass()} value={r.requirement ?? ""} onChange={(e) => change(i, { requirement: e.target.value })} />
              </label>
            )}
            <div className="flex items-end">
              <Button onClick={() => setRows(current.filter((_, j) => j !== i))}>Remove</Button>
            </div>
          </fieldset>
        ))}
        <div className="flex flex-wrap gap-2">
          {proposals.length > 0 ? (
            <Button onClick={() => setRows([...current, ...proposals.map(toRow)])}>Add proposed ({proposals.map((p) => p.property).join(", ")})</Button>
          ) : null}
          <Button
            onClick={() =>
              setRows([
                ...current,
                { id: crypto.randomUUID(), property: "", method: "", unit: "", numeric: true, target: "", lower: "", upper: "", requirement: null, origin: "entered" },
              ])
            }
          >
            Add your own
          </Button>
          <Button variant="primary" busy={busy} onClick={save} disabled={rows === null}>
            Save tests and limits
          </Button>
          {message ? <span className="text-sm" role="status">{message}</span> : null}
        </div>
      </div>
    </Panel>
  );
}
