import type { Metadata } from "next";
import { AcceptInvitation } from "@/components/auth/accept-invitation";
import { ButtonLink } from "@/components/ui/button";
import { getContext } from "@/lib/session";

export const metadata: Metadata = { title: "Invitation" };

interface InvitationPageProps {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ error?: string | string[] }>;
}

export default async function InvitationPage({ params, searchParams }: InvitationPageProps) {
  const { id } = await params;
  const { error } = await searchParams;
  const ctx = await getContext();
  const next = encodeURIComponent(`/invitations/${encodeURIComponent(id)}`);
  if (!ctx) {
    return (
      <div className="rounded border border-rule bg-panel p-5">
        <h1 className="text-lg font-semibold">You are invited to a team</h1>
        <p className="mt-2 text-sm text-muted">
          Sign in with the e-mail address the invitation was sent to, or create an account with it. Before you can join, we
          mail a link to that address to confirm it is yours.
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
  return <AcceptInvitation invitationId={id} email={ctx.email} linkError={typeof error === "string" ? error.slice(0, 40) : null} />;
}
