import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BatchRecordView } from "@/components/batches/batch-record-view";
import { BatchStateBadge } from "@/components/batches/batch-words";
import type { BatchDto } from "@/components/batches/types";
import { pageContext } from "@/components/layout/page-context";
import { ButtonLink } from "@/components/ui/button";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { getBatch } from "@/db/queries/batches";
import { fmtDateTime } from "@/lib/format";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Batch record" };

export default async function BatchRecordPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch records" />;
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const found = await getBatch(ctx.teamId, id);
  if (!found) notFound();
  const batch = JSON.parse(JSON.stringify(found)) as BatchDto;
  const canRecord = can(ctx.role, "batch:update");
  return (
    <>
      <PageHeader
        title={
          <span className="flex flex-wrap items-center gap-2">
            Batch record <BatchStateBadge state={batch.state} />
          </span>
        }
        subtitle={
          <span className="num">
            <Link href={`/batches?formulationId=${batch.formulationId}`} className="text-accent underline">
              {batch.formulationName}
            </Link>{" "}
            · revision {batch.revisionNumber} · started {fmtDateTime(batch.createdAt)} by {batch.startedByName ?? "unknown"}
            {batch.closedAt ? ` · closed ${fmtDateTime(batch.closedAt)} by ${batch.closedByName ?? "unknown"}` : ""}
          </span>
        }
        actions={
          canRecord && batch.state === "open" ? (
            <ButtonLink href={`/batches/${batch.id}/weigh`} variant="primary">
              Record weighings
            </ButtonLink>
          ) : null
        }
      />
      <BatchRecordView initial={batch} canRecord={canRecord} />
    </>
  );
}
