import type { Metadata } from "next";
import Link from "next/link";
import { listLots } from "@/db/queries/lots";
import { listMaterials } from "@/db/queries/materials";
import { pageContext } from "@/components/layout/page-context";
import { ReceiveLotForm } from "@/components/quality/receive-lot-form";
import { NotAllowed, PageHeader, Panel } from "@/components/ui/panel";
import { TD, TDN, TH, THN } from "@/components/ui/table-head";
import { TEXT_LINK } from "@/components/ui/text-link";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Material lots" };

/** Lots of the team's materials, earliest expiry first; production and admin receive new ones. */
export default async function LotsPage() {
  const ctx = await pageContext();
  if (!can(ctx.role, "lot:read")) return <NotAllowed what="see material lots" />;
  const { rows } = await listLots(ctx.teamId);
  const canReceive = can(ctx.role, "lot:receive");
  const materials = canReceive ? (await listMaterials(ctx.teamId, { pageSize: 500 })).rows.map((m) => ({ id: m.id, name: m.name })) : [];
  return (
    <>
      <PageHeader title="Material lots" subtitle="Supplier lots as received, earliest expiry first. Open a lot for its certificate and every batch that used it." />
      <div className="flex flex-col gap-4">
        {canReceive ? <ReceiveLotForm materials={materials} /> : null}
        <Panel title="Lots" id="lots">
          {rows.length === 0 ? (
            <p className="text-sm text-muted">No lot has been received yet.</p>
          ) : (
            <table className="w-full text-sm" data-testid="lots-table">
              <thead>
                <tr>
                  <th className={TH}>Material</th>
                  <th className={TH}>Supplier lot</th>
                  <th className={TH}>Supplier</th>
                  <th className={THN}>On hand</th>
                  <th className={TH}>Received</th>
                  <th className={TH}>Expires</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.id} className="border-t border-rule">
                    <td className={TD}>{r.materialName}</td>
                    <td className={TD}>
                      <Link className={TEXT_LINK} href={`/lots/${r.id}`}>
                        {r.supplierLot}
                      </Link>
                    </td>
                    <td className={TD}>{r.supplier}</td>
                    <td className={TDN}>
                      {Number(r.quantityOnHand.toPrecision(6))} {r.unit}
                      {r.quantityOnHand <= 0 ? <span className="ml-1 text-fail">(used up)</span> : null}
                    </td>
                    <td className={TD}>{r.receivedOn}</td>
                    <td className={TD}>
                      {r.expiresOn ?? "no expiry"}
                      {r.expired ? <span className="ml-1 font-medium text-fail">(expired)</span> : null}
                    </td>
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
