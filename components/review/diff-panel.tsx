"use client";

import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { TableHead } from "@/components/ui/table-head";
import { useRevisionDiff } from "@/lib/client/formulations";
import type { DiffEntry } from "@/lib/diff";

function show(value: unknown): string {
  if (value === null || value === undefined) return "—";
  if (typeof value === "number") return String(Number(value.toPrecision(6)));
  if (typeof value === "string") return value;
  return JSON.stringify(value);
}

function DiffTable({ caption, rows }: { caption: string; rows: DiffEntry[] }) {
  if (rows.length === 0) return <p className="text-sm text-muted">No change in {caption.toLowerCase()}.</p>;
  return (
    <table className="w-full text-sm">
      <caption className="mb-1 text-left text-xs font-semibold text-muted">{caption}</caption>
      <TableHead columns={["What", "Before", "After"]} />
      <tbody>
        {rows.map((r) => (
          <tr key={r.path} className="border-b border-rule/60 align-top">
            <td className="px-2 py-1 font-mono text-xs break-all">{r.path}</td>
            <td className="num px-2 py-1 break-all text-fail">{show(r.before)}</td>
            <td className="num px-2 py-1 break-all text-clear">{show(r.after)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

interface DiffPanelProps {
  formulationId: string;
  from: number;
  to: number;
}

/** What changed since the previous revision: inputs and key results. */
export function DiffPanel({ formulationId, from, to }: DiffPanelProps) {
  const { data, error, isLoading, mutate } = useRevisionDiff(formulationId, from, to);
  if (error) return <ErrorPanel message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={3} label="Loading the changes" />;
  return (
    <div className="grid gap-4 md:grid-cols-2" data-testid="diff">
      <DiffTable caption="Inputs" rows={data.input} />
      <DiffTable caption="Key results" rows={data.results} />
      <DiffTable caption="Tests and limits" rows={data.specifications ?? []} />
    </div>
  );
}
