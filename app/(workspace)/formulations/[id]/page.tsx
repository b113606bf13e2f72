import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { SavedExplorations } from "@/components/explore/saved-explorations";
import { RevisionsTable } from "@/components/history/revisions-table";
import { pageContext } from "@/components/layout/page-context";
import { PageHeader, Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/status";
import { getFormulation } from "@/db/queries/formulations";
import { explorerUrl } from "@/lib/client/downloads";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Formulation" };

export default async function FormulationPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  const { id } = await params;
  const f = await getFormulation(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!f) notFound();
  const latest = f.revisions[0];
  return (
    <>
      <PageHeader
        title={f.name}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            {f.project ?? "No project"} {latest ? <StateBadge state={latest.state} /> : null}
          </span>
        }
        actions={
          <>
            {latest ? (
              <Link href={`/revisions/${latest.id}`} className="rounded border border-accent bg-accent px-3 py-1.5 text-sm font-medium text-white">
                Open revision {latest.number}
              </Link>
            ) : null}
            {latest && can(ctx.role, "formulation:readUnreleased") ? (
              <Link href={explorerUrl(f.id, { revisionId: latest.id })} className="rounded border border-rule bg-panel px-3 py-1.5 text-sm font-medium" data-testid="explore-link">
                Explore
              </Link>
            ) : null}
            {can(ctx.role, "batch:read") ? (
              <Link href={`/batches?formulationId=${f.id}`} className="rounded border border-rule bg-panel px-3 py-1.5 text-sm font-medium">
                Batch records
              </Link>
            ) : null}
            {can(ctx.role, "batch:read") ? (
              <Link href={`/formulations/${f.id}/charts`} className="rounded border border-rule bg-panel px-3 py-1.5 text-sm font-medium">
                Control charts
              </Link>
            ) : null}
            {can(ctx.role, "audit:read") ? (
              <Link href={`/formulations/${f.id}/history`} className="rounded border border-rule bg-panel px-3 py-1.5 text-sm font-medium">
                History
              </Link>
            ) : null}
          </>
        }
      />
      {f.description ? <p className="mb-4 max-w-3xl text-sm">{f.description}</p> : null}
      <Panel title="Revisions" id="revisions">
        <RevisionsTable rows={f.revisions} canEdit={can(ctx.role, "formulation:update")} />
      </Panel>
      {can(ctx.role, "formulation:readUnreleased") ? (
        <Panel title="Saved explorations" id="explorations" className="mt-4">
          <SavedExplorations formulationId={f.id} canDelete={can(ctx.role, "formulation:update")} />
        </Panel>
      ) : null}
    </>
  );
}
