import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Explorer } from "@/components/explore/explorer";
import { savedSetupOf, type SavedSetup } from "@/components/explore/saved-setup";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { getFormulation, getRevision } from "@/db/queries/formulations";
import { can } from "@/lib/permissions";
import { STATE_LABELS } from "@/lib/workflow";

export const metadata: Metadata = { title: "Design explorer" };

interface ExplorePageProps {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ revision?: string | string[]; exploration?: string | string[] }>;
}

const one = (v: string | string[] | undefined): string | undefined => (Array.isArray(v) ? v[0] : v) || undefined;

/**
 * The design explorer of one revision: sweeps, composition maps and a target
 * search, computed in the browser (a Web Worker) on the revision's stored
 * input. ?revision=<id> picks the revision (default the newest);
 * ?exploration=<id> fills the setup from a saved exploration.
 */
export default async function ExplorePage({ params, searchParams }: ExplorePageProps) {
  const ctx = await pageContext();
  if (!can(ctx.role, "formulation:readUnreleased")) return <NotAllowed what="explore formulations" />;
  const { id } = await params;
  const query = await searchParams;
  const formulation = await getFormulation(ctx.teamId, id);
  if (!formulation || formulation.revisions.length === 0) notFound();

  const saved: SavedSetup | null = await savedSetupOf(ctx.teamId, formulation.id, one(query.exploration));
  const wanted = one(query.revision) ?? saved?.revisionId;
  const listed = wanted ? formulation.revisions.find((r) => r.id === wanted) : formulation.revisions[0];
  if (!listed) notFound();
  const rev = await getRevision(ctx.teamId, listed.id);
  if (!rev || rev.formulationId !== formulation.id) notFound();

  return (
    <>
      <PageHeader
        title={`Explore ${formulation.name}`}
        subtitle={
          <>
            Revision {rev.number} ({STATE_LABELS[rev.state].toLowerCase()}) ·{" "}
            <Link href={`/revisions/${rev.id}`} className="text-accent underline">
              Open the revision
            </Link>{" "}
            ·{" "}
            <Link href={`/formulations/${formulation.id}`} className="text-accent underline">
              Back to the formulation
            </Link>
          </>
        }
      />
      <nav aria-label="Revision to explore" className="mb-3 flex flex-wrap items-center gap-2 text-sm">
        <span className="text-muted">Revision:</span>
        {formulation.revisions.map((r) => (
          <Link
            key={r.id}
            href={`/formulations/${formulation.id}/explore?revision=${r.id}`}
            aria-current={r.id === rev.id ? "page" : undefined}
            className={r.id === rev.id ? "rounded border border-accent px-2 py-0.5 font-medium text-ink" : "rounded border border-rule px-2 py-0.5 text-accent"}
          >
            {r.number} · {STATE_LABELS[r.state].toLowerCase()}
          </Link>
        ))}
      </nav>
      <Explorer
        key={`${rev.id}:${saved?.id ?? ""}`}
        formulationId={formulation.id}
        revision={{ id: rev.id, number: rev.number, input: rev.input }}
        saved={saved && saved.revisionId === rev.id ? saved : null}
        canUpdate={can(ctx.role, "formulation:update")}
      />
    </>
  );
}
