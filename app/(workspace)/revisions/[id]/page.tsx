import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageContext } from "@/components/layout/page-context";
import { RevisionView } from "@/components/review/revision-view";
import type { RevisionDto } from "@/components/review/types";
import { getRevision } from "@/db/queries/formulations";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Revision" };

export default async function RevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  const { id } = await params;
  const readUnreleased = can(ctx.role, "formulation:readUnreleased");
  const rev = await getRevision(ctx.teamId, id, { releasedOnly: !readUnreleased });
  if (!rev) notFound();
  const initial = JSON.parse(JSON.stringify(rev)) as RevisionDto;
  return (
    <RevisionView
      initial={initial}
      can={{
        userId: ctx.userId,
        update: can(ctx.role, "formulation:update"),
        submit: can(ctx.role, "formulation:submit"),
        review: can(ctx.role, "formulation:review"),
        release: can(ctx.role, "formulation:release"),
        archive: can(ctx.role, "formulation:archive"),
        readUnreleased,
      }}
    />
  );
}
