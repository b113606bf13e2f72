import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { listLotAdjustments } from "@/db/queries/lot-adjustments";
import { getLot } from "@/db/queries/lots";
import { pageContext } from "@/components/layout/page-context";
import { LotAdjustmentForm } from "@/components/quality/lot-adjustment-form";
import { LotAdjustmentHistory } from "@/components/quality/lot-adjustment-history";
import { LotAttachments } from "@/components/quality/lot-attachments";
import { LotCorrectionForm } from "@/components/quality/lot-correction-form";
import { DownloadLinks } from "@/components/exports/download-links";
import { NotAllowed, PageHeader, Panel } from "@/components/ui/panel";
import { TD, TDN, TH, THN } from "@/components/ui/table-head";
import { TEXT_LINK } from "@/components/ui/text-link";
import { DISPOSITION_LABELS } from "@/lib/labels";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Material lot" };

const qty = (n: number | null, unit: string) => (n === null ? "not yet taken" : `${Number(n.toPrecision(6))} ${unit}`);

/** One lot: what was received, its certificate of analysis, and every batch that used it (for a supplier recall). */
export default async function LotPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "lot:read")) return <NotAllowed what="see material lots" />;
  const id = (await params).id;
  const [lot, adjustments] = await Promise.all([getLot(ctx.teamId, id), listLotAdjustments(ctx.teamId, id)]);
  if (!lot || !adjustments) notFound();
  return (
    <>
      <PageHeader
        title={`Lot ${lot.supplierLot}`}
        subtitle={
          <>
            {lot.materialName} from {lot.supplier} · <Link className={TEXT_LINK} href="/lots">all lots</Link>
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <Panel title="Received" id="received">
          <dl className="num grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-muted">Quantity received</dt>
            <dd>{qty(lot.quantityReceived, lot.unit)}</dd>
            <dt className="text-muted">On hand</dt>
            <dd>
              <span data-testid="lot-on-hand">{qty(lot.quantityOnHand, lot.unit)}</span>
              {lot.quantityOnHand <= 0 ? <span className="ml-1 text-fail">(used up)</span> : null}
            </dd>
            <dt className="text-muted">Received on</dt>
            <dd>
              {lot.receivedOn}
              {lot.receivedByName ? ` by ${lot.receivedByName}` : ""}
            </dd>
            <dt className="text-muted">Expires on</dt>
            <dd>
              {lot.expiresOn ?? "no expiry given"}
              {lot.expired ? <strong className="ml-1 text-fail">expired</strong> : null}
            </dd>
            <dt className="text-muted">Measured assay</dt>
            <dd>{lot.measuredAssay === null ? "not measured (the material's nominal assay applies)" : `${lot.measuredAssay} (mass fraction)`}</dd>
            {lot.notes ? (
              <>
                <dt className="text-muted">Notes</dt>
                <dd className="whitespace-pre-wrap">{lot.notes}</dd>
              </>
            ) : null}
          </dl>
          {can(ctx.role, "lot:update") ? (
            <LotCorrectionForm
              key={lot.version}
              lot={{ id: lot.id, version: lot.version, supplier: lot.supplier, supplierLot: lot.supplierLot, expiresOn: lot.expiresOn, measuredAssay: lot.measuredAssay, notes: lot.notes }}
            />
          ) : null}
          {can(ctx.role, "lot:update") ? (
            <LotAdjustmentForm key={`adjust-${lot.version}`} lot={{ id: lot.id, version: lot.version, unit: lot.unit, quantityOnHand: lot.quantityOnHand }} />
          ) : null}
        </Panel>
        <LotAdjustmentHistory adjustments={adjustments} />
        <LotAttachments lotId={lot.id} canChange={can(ctx.role, "lot:update")} />
        <Panel title="Batches that used this lot" id="uses">
          <DownloadLinks
            links={[
              { href: `/api/lots/${lot.id}/export?format=xlsx`, label: "Batches (.xlsx)", description: "Every batch that used this lot, as a workbook" },
              { href: `/api/lots/${lot.id}/export?format=csv`, label: "Batches (.csv)", description: "Every batch that used this lot, as CSV" },
            ]}
          />
          {lot.uses.length === 0 ? (
            <p className="text-sm text-muted">No batch has used this lot.</p>
          ) : (
            <table className="mt-2 w-full text-sm" data-testid="lot-uses">
              <thead>
                <tr>
                  <th className={TH}>Batch</th>
                  <th className={TH}>Formulation</th>
                  <th className={TH}>Line</th>
                  <th className={TH}>Disposition</th>
                  <th className={THN}>Taken</th>
                </tr>
              </thead>
              <tbody>
                {lot.uses.map((u) => (
                  <tr key={`${u.batchId}-${u.lineIndex}`} className="border-t border-rule">
                    <td className={TD}>
                      <Link className={TEXT_LINK} href={`/batches/${u.batchId}`}>
                        {u.batchId.slice(0, 8)}
                      </Link>
                    </td>
                    <td className={TD}>
                      {u.formulationName}, revision {u.revisionNumber}
                    </td>
                    <td className={TD}>{u.lineIndex + 1}</td>
                    <td className={TD}>{u.disposition ? DISPOSITION_LABELS[u.disposition] : u.batchState === "open" ? "open" : "waiting for disposition"}</td>
                    <td className={TDN}>{qty(u.quantityUsed, lot.unit)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Panel>
      </div>
    </>
  );
}
