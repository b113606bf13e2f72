"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiRequestError, apiSend, errorMessage } from "@/lib/client/fetcher";
import { isPointRefusal, pointInput } from "@/lib/explore/apply";
import type { Candidate } from "@/lib/explore/spec";
import type { ExplorationRun, OutputInfo } from "@/lib/explore/types";
import type { FormulationInput } from "@/lib/formulation";
import { axisFactor, STATUS_WORDS, valueText, withUnit } from "./plots/display";

interface CandidatesProps {
  formulationId: string;
  base: FormulationInput;
  run: ExplorationRun;
  candidates: Candidate[];
  /** Figures to list, with their words and units. */
  outputs: OutputInfo[];
  /** The saved exploration the run belongs to, when saved. */
  explorationId?: string;
  canUpdate: boolean;
}

/** Column headings and shown values of a candidate's variables. */
function variableColumns(run: ExplorationRun): { label: string; unit: string; factor: number }[] {
  const t = run.plan.ternary;
  if (t) return t.labels.map((label) => ({ label, unit: "wt%", factor: 100 }));
  return run.plan.axes.map((a) => ({ label: a.label, unit: a.unit, factor: axisFactor(a) }));
}

/**
 * The best candidates of a target search with their variable values and
 * figures; each opens as a new draft revision (computed by the full engine).
 */
export function Candidates({ formulationId, base, run, candidates, outputs, explorationId, canUpdate }: CandidatesProps) {
  const router = useRouter();
  const [busy, setBusy] = useState<number | null>(null);
  const [messages, setMessages] = useState<Record<number, string>>({});
  const columns = variableColumns(run);

  async function open(c: Candidate) {
    setBusy(c.point);
    setMessages((m) => ({ ...m, [c.point]: "" }));
    const input = pointInput(base, run.plan, c.point);
    if (isPointRefusal(input)) {
      setMessages((m) => ({ ...m, [c.point]: `This point cannot become a recipe (${input.code} at ${input.field}).` }));
      setBusy(null);
      return;
    }
    try {
      const body = { input, fromExploration: { point: c.point, ...(explorationId ? { explorationId } : {}) } };
      const made = await apiSend<{ revisionId: string }>("POST", `/api/formulations/${formulationId}/revisions`, body);
      router.push(`/revisions/${made.revisionId}/edit`);
    } catch (err) {
      const text = err instanceof ApiRequestError && err.status === 409 ? err.message : errorMessage(err);
      setMessages((m) => ({ ...m, [c.point]: text }));
      setBusy(null);
    }
  }

  if (candidates.length === 0) {
    return (
      <p className="text-sm" data-testid="no-candidates">
        No point of this grid meets the limits and the thermal verdict asked for. Widen the ranges or loosen a limit.
      </p>
    );
  }
  return (
    <div className="overflow-x-auto">
      <table className="num w-full border-collapse text-sm" data-testid="candidates">
        <caption className="mb-1 text-left text-[13px] text-muted">
          Best {candidates.length} candidates, best first. Figures from the fast numeric path; a draft opened from a candidate is computed by the full engine.
        </caption>
        <thead>
          <tr className="border-b border-rule text-left">
            <th scope="col" className="px-2 py-1">
              Rank
            </th>
            {columns.map((c) => (
              <th key={c.label} scope="col" className="px-2 py-1">
                {withUnit(c.label, c.unit)}
              </th>
            ))}
            {outputs.map((o) => (
              <th key={o.key} scope="col" className="px-2 py-1">
                {withUnit(o.label, o.unit)}
              </th>
            ))}
            <th scope="col" className="px-2 py-1">
              Thermal check
            </th>
            {canUpdate ? (
              <th scope="col" className="px-2 py-1">
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {candidates.map((c, rank) => (
            <tr key={c.point} className="border-b border-rule/60 align-top" data-testid="candidate" data-point={c.point}>
              <td className="px-2 py-1">{rank + 1}</td>
              {columns.map((col, i) => (
                <td key={col.label} className="px-2 py-1" data-testid="candidate-value">
                  {valueText((c.values[i] ?? Number.NaN) * col.factor, col.unit)}
                </td>
              ))}
              {outputs.map((o) => (
                <td key={o.key} className="px-2 py-1" data-testid={`candidate-figure-${o.key}`}>
                  {valueText((c.figures[o.key] ?? Number.NaN) * (o.percent ? 100 : 1), o.unit)}
                </td>
              ))}
              <td className="px-2 py-1">{STATUS_WORDS[c.thermalStatus]}</td>
              {canUpdate ? (
                <td className="px-2 py-1">
                  <Button onClick={() => open(c)} busy={busy === c.point} disabled={busy !== null} aria-describedby={`candidate-${c.point}-message`}>
                    Open as a new draft
                  </Button>
                  <p id={`candidate-${c.point}-message`} aria-live="polite" className="max-w-xs text-[13px] text-fail empty:hidden">
                    {messages[c.point] || null}
                  </p>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
