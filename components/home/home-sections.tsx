import "server-only";
import { listAuditEvents } from "@/db/queries/audit";
import { listFormulations } from "@/db/queries/formulations";
import { EventList } from "@/components/history/event-list";
import type { TeamContext } from "@/lib/session";
import { FormulationMiniList } from "./formulation-mini-list";

interface SectionProps {
  ctx: TeamContext;
}

/** Drafts the user created that are still drafts. */
export async function MyDrafts({ ctx }: SectionProps) {
  const { rows } = await listFormulations(ctx.teamId, { state: "draft", sort: "updatedAt", dir: "desc", pageSize: 50 });
  const mine = rows.filter((r) => r.createdBy === ctx.userId).slice(0, 8);
  return <FormulationMiniList rows={mine} empty="No drafts of yours. Start a new formulation." />;
}

/** Revisions waiting for review that someone else wrote. */
export async function WaitingForReview({ ctx }: SectionProps) {
  const { rows } = await listFormulations(ctx.teamId, { state: "in_review", sort: "updatedAt", dir: "desc", pageSize: 20 });
  const others = rows.filter((r) => r.createdBy !== ctx.userId).slice(0, 8);
  return <FormulationMiniList rows={others} empty="Nothing is waiting for your review." />;
}

/** The newest released formulations. */
export async function RecentlyReleased({ ctx, releasedOnly }: SectionProps & { releasedOnly: boolean }) {
  const { rows } = await listFormulations(ctx.teamId, { state: "released", sort: "updatedAt", dir: "desc", pageSize: 8, releasedOnly });
  return <FormulationMiniList rows={rows} empty="Nothing has been released to production yet." />;
}

/** The team's latest recorded events. */
export async function RecentActivity({ ctx }: SectionProps) {
  const { rows } = await listAuditEvents(ctx.teamId, { pageSize: 10 });
  return <EventList events={rows} />;
}
