import type { Metadata } from "next";
import Link from "next/link";
import { AttachmentsPanel } from "@/components/attachments/attachments-panel";
import { BatchEntry } from "@/components/batches/batch-entry";
import { batchForPage, BatchOrigin, BatchTitle } from "@/components/batches/batch-page";
import { pageContext } from "@/components/layout/page-context";
import { Alert } from "@/components/ui/alert";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
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
  const batch = await batchForPage(ctx.teamId, (await params).id);
  const header = <PageHeader title={<BatchTitle title="Record weighings" batch={batch} />} subtitle={<BatchOrigin batch={batch} withSheet />} />;
  if (batch.state === "closed") {
    return (
      <>
        {header}
        <Alert tone="info">
          This batch record was closed {fmtDateTime(batch.closedAt)} and can no longer change.{" "}
          <Link href={`/batches/${batch.id}`} className="text-accent underline">
            Read the record
          </Link>
          .
        </Alert>
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
