import "server-only";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getBatch } from "@/db/queries/batches";
import type { Batch } from "@/lib/client/batches";
import { fmtDateTime } from "@/lib/format";
import { BatchStateBadge } from "./batch-words";

/** The batch record a page shows, as the browser will hold it (JSON); the not-found page for a missing or malformed id. */
export async function batchForPage(teamId: string, id: string): Promise<Batch> {
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const found = await getBatch(teamId, id);
  if (!found) notFound();
  return JSON.parse(JSON.stringify(found)) as Batch;
}

interface BatchTitleProps {
  title: string;
  batch: Batch;
}

/** A batch page's title with the record's state. */
export function BatchTitle({ title, batch }: BatchTitleProps) {
  return (
    <span className="flex flex-wrap items-center gap-2">
      {title} <BatchStateBadge state={batch.state} />
    </span>
  );
}

interface BatchOriginProps {
  batch: Batch;
  /** Where the formulation name links to. */
  formulationHref?: string;
  /** Also link the revision's batch sheet. */
  withSheet?: boolean;
}

/** Formulation, revision, who started (and closed) the record and when. */
export function BatchOrigin({ batch, formulationHref, withSheet = false }: BatchOriginProps) {
  return (
    <span className="num">
      {formulationHref ? (
        <Link href={formulationHref} className="text-accent underline">
          {batch.formulationName}
        </Link>
      ) : (
        batch.formulationName
      )}{" "}
      · revision {batch.revisionNumber} ·{" "}
      {withSheet ? (
        <>
          <Link href={`/revisions/${batch.revisionId}/batch-sheet`} className="text-accent underline">
            batch sheet
          </Link>{" "}
          ·{" "}
        </>
      ) : null}
      started {fmtDateTime(batch.createdAt)} by {batch.startedByName ?? "unknown"}
      {batch.closedAt ? ` · closed ${fmtDateTime(batch.closedAt)} by ${batch.closedByName ?? "unknown"}` : ""}
    </span>
  );
}
