import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { FormulationEvents } from "@/components/history/formulation-events";
import { RevisionsTable } from "@/components/history/revisions-table";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed, PageHeader, Panel } from "@/components/ui/panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { getFormulation } from "@/db/queries/formulations";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "History" };

export default async function HistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "audit:read")) return <NotAllowed what="see the history of formulations" />;
  const { id } = await params;
  const f = await getFormulation(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!f) notFound();
  return (
    <>
      <PageHeader
        title={`History of ${f.name}`}
        subtitle={
          <Link href={`/formulations/${f.id}`} className="text-accent underline">
            Back to the formulation
          </Link>
        }
      />
      <div className="grid gap-4 xl:grid-cols-2">
        <Panel title="Revisions" id="revisions">
          <RevisionsTable rows={f.revisions} canEdit={can(ctx.role, "formulation:update")} />
        </Panel>
        <Panel title="Recorded events" id="events">
          <Suspense fallback={<TableSkeleton rows={6} label="Loading events" />}>
            <FormulationEvents teamId={ctx.teamId} formulationId={f.id} revisionIds={f.revisions.map((r) => r.id)} />
          </Suspense>
        </Panel>
      </div>
    </>
  );
}
