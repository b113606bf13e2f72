import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AttachmentsPanel } from "@/components/attachments/attachments-panel";
import { BatchEntry } from "@/components/batches/batch-entry";
import { BatchStateBadge } from "@/components/batches/batch-words";
import type { BatchDto } from "@/components/batches/types";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { getBatch } from "@/db/queries/batches";
import { fmtDateTime } from "@/lib/format";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Record weighings" };

/** "Pat Production" → "PP". */
function initialsOf(name: string): string {
  return name
    .split(/\s+/)
    .filter(Boolean)
    .map((w) => w[0]!.toUpperCase())
    .join("")
    .slice(0, 4);
}

export default async function WeighPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:update")) return <NotAllowed what="record batch weighings" />;
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const found = await getBatch(ctx.teamId, id);
  if (!found) notFound();
  const batch = JSON.parse(JSON.stringify(found)) as BatchDto;
  const header = (
    <PageHeader
      title={
        <span className="flex flex-wrap items-center gap-2">
          Record weighings <BatchStateBadge state={batch.state} />
        </span>
      }
      subtitle={
        <span className="num">
          {batch.formulationName} · revision {batch.revisionNumber} ·{" "}
          <Link href={`/revisions/${batch.revisionId}/batch-sheet`} className="text-accent underline">
            batch sheet
          </Link>{" "}
          · started {fmtDateTime(batch.createdAt)} by {batch.startedByName ?? "unknown"}
        </span>
      }
    />
  );
  if (batch.state === "closed") {
    return (
      <>
        {header}
        <p role="status" className="rounded border border-rule bg-panel px-3 py-2 text-sm">
          This batch record was closed {fmtDateTime(batch.closedAt)} and can no longer change.{" "}
          <Link href={`/batches/${batch.id}`} className="text-accent underline">
            Read the record
          </Link>
          .
        </p>
      </>
    );
  }
  return (
    <>
      {header}
      <div className="flex flex-col gap-4">
        <BatchEntry initial={batch} defaultInitials={initialsOf(ctx.userName)} />
        <AttachmentsPanel ownerType="batch" ownerId={batch.id} canChange defaultKind="coa" />
      </div>
    </>
  );
}
