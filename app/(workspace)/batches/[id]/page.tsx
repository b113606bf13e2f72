import type { Metadata } from "next";
import { batchForPage, BatchOrigin, BatchTitle } from "@/components/batches/batch-page";
import { BatchRecordView } from "@/components/batches/batch-record-view";
import { BatchLotsDisposition } from "@/components/quality/batch-lots-disposition";
import { dispositionStatus } from "@/db/queries/dispositions";
import { batchLots, lineGrams, lotsOfMaterials } from "@/db/queries/lots";
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
  const [lots, status, choices] = await Promise.all([
    batchLots(ctx.teamId, batch.id),
    dispositionStatus(ctx.teamId, batch.id, ctx.userId),
    batch.state === "open" && canRecord ? lotsOfMaterials(ctx.teamId, [...new Set(batch.lines.map((l) => l.materialId))]) : Promise.resolve([]),
  ]);
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
      <div className="mt-4 flex flex-col gap-4">
        <BatchLotsDisposition
          batchId={batch.id}
          open={batch.state === "open"}
          closed={batch.state === "closed"}
          canRecord={canRecord}
          canDispose={can(ctx.role, "batch:dispose")}
          lines={batch.lines.map((l) => ({ index: l.index, name: l.name ?? l.materialId, materialId: l.materialId, role: l.role, grams: lineGrams(l) }))}
          uses={lots?.rows ?? []}
          choices={choices}
          status={status!}
        />
      </div>
    </>
  );
}
