import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageContext } from "@/components/layout/page-context";
import { StartBatchPanel } from "@/components/batches/start-batch-panel";
import { DownloadLinks, revisionDownloads } from "@/components/exports/download-links";
import { BatchSheet } from "@/components/production/batch-sheet";
import { ErrorPanel } from "@/components/ui/error-panel";
import { NotAllowed } from "@/components/ui/panel";
import { getBatchSettings } from "@/db/queries/batches";
import { getRevision } from "@/db/queries/formulations";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Batch sheet" };

export default async function BatchSheetPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch sheets" />;
  const { id } = await params;
  const rev = await getRevision(ctx.teamId, id, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") });
  if (!rev) notFound();
  if (!rev.result) return <ErrorPanel title="No batch sheet" message={`The recipe cannot be computed: ${rev.computeError ?? "no result stored"}.`} />;
  const released = rev.state === "released";
  const settings = released ? await getBatchSettings(ctx.teamId) : null;
  return (
    <div className="flex flex-col gap-4">
      <DownloadLinks links={revisionDownloads(rev.id)} />
      <BatchSheet
        formulationName={rev.formulationName}
        project={rev.project}
        revisionNumber={rev.number}
        released={released}
        releasedAt={rev.releasedAt ? new Date(rev.releasedAt).toISOString() : null}
        input={rev.input}
        result={rev.result}
      />
      {settings ? (
        <StartBatchPanel
          revisionId={rev.id}
          revisionNumber={rev.number}
          toleranceFraction={settings.toleranceFraction}
          balanceResolutionGrams={settings.balanceResolutionGrams}
          canStart={can(ctx.role, "batch:create")}
        />
      ) : null}
    </div>
  );
}
