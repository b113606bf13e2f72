"use client";

import Link from "next/link";
import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { TableHead, TD, TDN } from "@/components/ui/table-head";
import { useBatches, type BatchListRow } from "@/lib/client/batches";
import type { BatchState } from "@/lib/enums";
import { fmtDateTime } from "@/lib/format";
import { BatchStateBadge } from "./batch-words";

interface BatchListProps {
  formulationId?: string;
  revisionId?: string;
  state?: BatchState;
  /** Open records link to the weighing entry (production) rather than the read-only record. */
  canRecord: boolean;
  /** Shown when there is nothing to list. */
  empty?: string;
}

/** Batch records, newest first, with how far each has come. Listed for one revision, the formulation column is left out. */
export function BatchList({ formulationId, revisionId, state, canRecord, empty = "No batch records yet." }: BatchListProps) {
  const { data, error, isLoading, mutate } = useBatches({ formulationId, revisionId, state });
  if (error) return <ErrorPanel title="Batch records could not be loaded" message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={3} label="Loading batch records" />;
  if (data.rows.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  const showFormulation = !revisionId;
  return (
    <div className="overflow-x-auto rounded border border-rule bg-panel">
      <table className="w-full text-sm" data-testid="batch-list">
        <caption className="sr-only">Batch records, newest first</caption>
        <TableHead
          rowClassName="bg-paper"
          columns={[
            "Started",
            { label: "Formulation", hidden: !showFormulation },
            "State",
            { label: "Weighed", numeric: true },
            "Tolerance check",
            "Started by",
            { label: "Open", srOnly: true },
          ]}
        />
        <tbody>
          {data.rows.map((r) => (
            <BatchRow key={r.id} row={r} showFormulation={showFormulation} canRecord={canRecord} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

interface BatchRowProps {
  row: BatchListRow;
  showFormulation: boolean;
  canRecord: boolean;
}

function BatchRow({ row: r, showFormulation, canRecord }: BatchRowProps) {
  const which = `${fmtDateTime(r.createdAt)}, ${r.formulationName}`;
  return (
    <tr className="border-b border-rule/60 last:border-0 hover:bg-paper/60">
      <td className={`${TD} num whitespace-nowrap`}>{fmtDateTime(r.createdAt)}</td>
      {showFormulation ? (
        <td className={TD}>
          {r.formulationName} <span className="text-muted">· revision {r.revisionNumber}</span>
        </td>
      ) : null}
      <td className={TD}>
        <BatchStateBadge state={r.state} />
      </td>
      <td className={TDN}>
        {r.weighed} of {r.lineCount}
      </td>
      <td className={TD}>
        {r.outside > 0 ? (
          <span className="font-medium text-fail">
            <span aria-hidden="true">✕ </span>
            {r.outside} outside tolerance
          </span>
        ) : r.weighed > 0 ? (
          <span className="text-clear">
            <span aria-hidden="true">✓ </span>all within tolerance
          </span>
        ) : (
          <span className="text-muted">nothing weighed</span>
        )}
      </td>
      <td className={TD}>{r.startedByName ?? "–"}</td>
      <td className={`${TD} whitespace-nowrap`}>
        <Link href={`/batches/${r.id}`} className="text-accent underline underline-offset-2">
          Record<span className="sr-only"> of {which}</span>
        </Link>
        {canRecord && r.state === "open" ? (
          <Link href={`/batches/${r.id}/weigh`} className="ml-3 text-accent underline underline-offset-2">
            Weigh<span className="sr-only"> batch of {which}</span>
          </Link>
        ) : null}
      </td>
    </tr>
  );
}
