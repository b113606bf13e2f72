import type { Metadata } from "next";
import { batchForPage, BatchOrigin, BatchTitle } from "@/components/batches/batch-page";
import { BatchRecordView } from "@/components/batches/batch-record-view";
import { pageContext } from "@/components/layout/page-context";
import { ButtonLink } from "@/components/ui/button";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Batch record" };

export default async function BatchRecordPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch records" />;
  const batch = await batchForPage(ctx.teamId, (await params).id);
  const canRecord = can(ctx.role, "batch:update");
  return (
    <>
      <PageHeader
        title={<BatchTitle title="Batch record" batch={batch} />}
        subtitle={<BatchOrigin batch={batch} formulationHref={`/batches?formulationId=${batch.formulationId}`} />}
        actions={
          canRecord && batch.state === "open" ? (
            <ButtonLink href={`/batches/${batch.id}/weigh`} variant="primary">
              Record weighings
            </ButtonLink>
          ) : null
        }
      />
      <BatchRecordView initial={batch} canRecord={canRecord} quality={{ canEnter: can(ctx.role, "batch:qc"), canAcknowledge: can(ctx.role, "batch:dispose") }} />
    </>
  );
}
