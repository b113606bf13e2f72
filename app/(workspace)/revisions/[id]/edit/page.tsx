import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { EditorLoader } from "@/components/formulation/editor-loader";
import { pageContext } from "@/components/layout/page-context";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { NotAllowed } from "@/components/ui/panel";
import { getRevision } from "@/db/queries/formulations";
import { can } from "@/lib/permissions";
import { STATE_LABELS } from "@/lib/workflow";

export const metadata: Metadata = { title: "Edit draft" };

export default async function EditRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "formulation:update")) return <NotAllowed what="edit formulations" />;
  const { id } = await params;
  const rev = await getRevision(ctx.teamId, id);
  if (!rev) notFound();
  if (rev.state !== "draft") {
    return (
      <Alert tone="info" className="p-4">
        <h1 className="text-lg font-semibold">
          {rev.formulationName}, revision {rev.number} cannot change
        </h1>
        <p className="mt-1 text-muted">
          It is {STATE_LABELS[rev.state].toLowerCase()}. Revisions that left the draft state never change; start a new revision to make changes.
        </p>
        <ButtonLink href={`/revisions/${rev.id}`} className="mt-3">
          Open the revision
        </ButtonLink>
      </Alert>
    );
  }
  return (
    <EditorLoader
      canSubmit={can(ctx.role, "formulation:submit")}
      revision={{
        id: rev.id,
        number: rev.number,
        version: rev.version,
        formulationId: rev.formulationId,
        formulationName: rev.formulationName,
        project: rev.project,
        input: rev.input,
      }}
    />
  );
}
