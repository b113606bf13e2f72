import type { Metadata } from "next";
import { pageContext } from "@/components/layout/page-context";
import { BatchTolerancePanel } from "@/components/team/batch-tolerance-panel";
import { CurrencyPanel } from "@/components/team/currency-panel";
import { InvitePanel } from "@/components/team/invite-panel";
import { MembersPanel } from "@/components/team/members-panel";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const ctx = await pageContext();
  return (
    <>
      <PageHeader
        title={ctx.teamName}
        subtitle="Members and their roles."
        actions={can(ctx.role, "mailbox:read") ? <ButtonLink href="/team/mail">Captured mail</ButtonLink> : null}
      />
      <div className="grid gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Panel title="Members" id="members">
          <MembersPanel userId={ctx.userId} canManage={can(ctx.role, "member:update")} canRemove={can(ctx.role, "member:delete")} />
        </Panel>
        {can(ctx.role, "invitation:create") ? (
          <Panel title="Invite by e-mail" id="invite">
            <InvitePanel />
          </Panel>
        ) : null}
        <Panel title="Weighing tolerance for batch records" id="tolerance">
          <BatchTolerancePanel canEdit={can(ctx.role, "organization:update")} />
        </Panel>
        <Panel title="Currency for prices and costs" id="currency">
          <CurrencyPanel canEdit={can(ctx.role, "organization:update")} />
        </Panel>
      </div>
    </>
  );
}
