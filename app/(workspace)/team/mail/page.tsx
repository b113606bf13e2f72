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
        subtitle="While the local fake mail server is in use, this team's own mail (invitations, review and release notices) lands here instead of a real inbox. Password-reset and address-confirmation mail goes to its owner only and is never shown here."
      />
      <MailboxList />
    </>
  );
}
