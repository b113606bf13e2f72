"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { authClient, authErrorMessage } from "@/lib/auth-client";
import { AuthCard, FormMessage } from "./auth-card";

interface AcceptInvitationProps {
  invitationId: string;
  email: string;
}

interface InvitationView {
  organizationName?: string;
  role?: string;
  inviterEmail?: string;
  email?: string;
  status?: string;
}

/** Shows an invitation to the signed-in user and accepts it. */
export function AcceptInvitation({ invitationId, email }: AcceptInvitationProps) {
  const router = useRouter();
  const [invitation, setInvitation] = useState<InvitationView | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    let live = true;
    authClient.organization.getInvitation({ query: { id: invitationId } }).then(({ data, error: err }) => {
      if (!live) return;
      if (err) setLoadError(err.status === 400 || err.status === 404 ? "This invitation is not for this account, has expired or was already used." : authErrorMessage(err));
      else setInvitation(data as InvitationView);
    });
    return () => {
      live = false;
    };
  }, [invitationId]);

  async function accept() {
    setBusy(true);
    setError(null);
    const { error: err } = await authClient.organization.acceptInvitation({ invitationId });
    setBusy(false);
    if (err) {
      setError(authErrorMessage(err));
      return;
    }
    router.replace("/home");
    router.refresh();
  }

  async function switchAccount() {
    await authClient.signOut();
    router.replace(`/sign-in?next=${encodeURIComponent(`/invitations/${encodeURIComponent(invitationId)}`)}`);
    router.refresh();
  }

  return (
    <AuthCard
      title="Join a team"
      intro={`Signed in as ${email}.`}
      footer={
        <button type="button" className="text-accent underline" onClick={switchAccount}>
          Use another account
        </button>
      }
    >
      {loadError ? (
        <FormMessage tone="error" message={loadError} />
      ) : !invitation ? (
        <p role="status" className="text-sm text-muted">
          Loading the invitation…
        </p>
      ) : (
        <div className="flex flex-col gap-3">
          <p className="text-sm">
            {invitation.inviterEmail ?? "A team admin"} invites you to join <strong>{invitation.organizationName ?? "a team"}</strong> as{" "}
            <strong>{invitation.role ?? "member"}</strong>.
          </p>
          <FormMessage tone="error" message={error} />
          <Button variant="primary" onClick={accept} busy={busy}>
            Accept and join
          </Button>
        </div>
      )}
    </AuthCard>
  );
}
