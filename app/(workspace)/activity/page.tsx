import type { Metadata } from "next";
import { pageContext } from "@/components/layout/page-context";
import { ActivityList } from "@/components/team/activity-list";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Activity" };

export default async function ActivityPage() {
  const ctx = await pageContext();
  if (!can(ctx.role, "audit:read")) return <NotAllowed what="see the team's activity" />;
  return (
    <>
      <PageHeader title="Activity" subtitle="Every recorded change in the team: who, when, what." />
      <ActivityList />
    </>
  );
}
