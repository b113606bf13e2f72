import type { Metadata } from "next";
import { Suspense } from "react";
import { MyDrafts, RecentActivity, RecentlyReleased, WaitingForReview } from "@/components/home/home-sections";
import { pageContext } from "@/components/layout/page-context";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const ctx = await pageContext();
  const unreleased = can(ctx.role, "formulation:readUnreleased");
  return (
    <>
      <PageHeader
        title={`Hello, ${ctx.userName}`}
        subtitle={ctx.teamName}
        actions={
          can(ctx.role, "formulation:create") ? (
            <ButtonLink href="/formulations/new" variant="primary">
              New formulation
            </ButtonLink>
          ) : null
        }
      />
      <div className="grid gap-4 lg:grid-cols-2">
        {can(ctx.role, "formulation:create") ? (
          <Panel title="My drafts" id="my-drafts">
            <Suspense fallback={<TableSkeleton rows={3} label="Loading drafts" />}>
              <MyDrafts ctx={ctx} />
            </Suspense>
          </Panel>
        ) : null}
        {can(ctx.role, "formulation:review") ? (
          <Panel title="Waiting for my review" id="waiting-review">
            <Suspense fallback={<TableSkeleton rows={3} label="Loading reviews" />}>
              <WaitingForReview ctx={ctx} />
            </Suspense>
          </Panel>
        ) : null}
        <Panel title="Recently released" id="recently-released">
          <Suspense fallback={<TableSkeleton rows={3} label="Loading released work" />}>
            <RecentlyReleased ctx={ctx} releasedOnly={!unreleased} />
          </Suspense>
        </Panel>
        {can(ctx.role, "audit:read") ? (
          <Panel title="Recent activity" id="recent-activity">
            <Suspense fallback={<TableSkeleton rows={5} label="Loading activity" />}>
              <RecentActivity ctx={ctx} />
            </Suspense>
          </Panel>
        ) : null}
      </div>
    </>
  );
}
