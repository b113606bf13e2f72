import type { Metadata } from "next";
import { pageContext } from "@/components/layout/page-context";
import { MailboxList } from "@/components/team/mailbox-list";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Captured mail" };

export default async function MailPage() {
  const ctx = await pageContext();
  if (!can(ctx.role, "mailbox:read")) return <NotAllowed what="read captured mail" />;
  return (
    <>
      <PageHeader
        title="Captured mail"
        subtitle="While the local fake mail server is in use, mail sent to this team's members and invitees lands here instead of a real inbox."
      />
      <MailboxList />
    </>
  );
}
