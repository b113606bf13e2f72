import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { pageContext } from "@/components/layout/page-context";
import { abilitiesOf } from "@/components/review/abilities";
import { RevisionView } from "@/components/review/revision-view";
import { getRevision } from "@/db/queries/formulations";
import { asJson } from "@/lib/client/json";

export const metadata: Metadata = { title: "Revision" };

export default async function RevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  const { id } = await params;
  const abilities = abilitiesOf(ctx.userId, ctx.role);
  const rev = await getRevision(ctx.teamId, id, { releasedOnly: !abilities.readUnreleased });
  if (!rev) notFound();
  return <RevisionView initial={asJson(rev)} can={abilities} />;
}
