import type { Metadata } from "next";
import { AcceptInvitation } from "@/components/auth/accept-invitation";
import { ButtonLink } from "@/components/ui/button";
import { getContext } from "@/lib/session";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const ctx = await getContext();
  const next = encodeURIComponent(`/invitations/${encodeURIComponent(id)}`);
  if (!ctx) {
    return (
      <div className="rounded border border-rule bg-panel p-5">
        <h1 className="text-lg font-semibold">You are invited to a team</h1>
        <p className="mt-2 text-sm text-muted">
          Sign in with the e-mail address the invitation was sent to, or create an account with it, then accept the invitation.
        </p>
        <div className="mt-4 flex flex-wrap gap-2">
          <ButtonLink href={`/sign-in?next=${next}`} variant="primary">
            Sign in
          </ButtonLink>
          <ButtonLink href={`/sign-up?next=${next}`}>Create an account</ButtonLink>
        </div>
      </div>
    );
  }
  return <AcceptInvitation invitationId={id} email={ctx.email} />;
}
