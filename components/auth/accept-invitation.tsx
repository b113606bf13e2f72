"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { authClient, authErrorCode, authErrorMessage } from "@/lib/auth-client";
import { AuthCard, FormMessage } from "./auth-card";

interface AcceptInvitationProps {
  invitationId: string;
  email: string;
  /** The error code the address-confirmation link came back with, if any. */
  linkError?: string | null;
}

/** An invitation as the sign-in library's client reads it. */
type InvitationView = NonNullable<Awaited<ReturnType<typeof authClient.organization.getInvitation>>["data"]>;

type Load =
  | { state: "loading" }
  | { state: "ready"; invitation: InvitationView }
  | { state: "unconfirmed" }
  | { state: "failed"; message: string };

const UNCONFIRMED = new Set(["email_verification_required_for_invitation", "email_verification_required_before_accepting_or_rejecting_invitation"]);

function linkErrorWords(code: string | null | undefined): string | null {
  if (!code) return null;
  if (code.toUpperCase() === "TOKEN_EXPIRED") return "That confirmation link has expired. Send a new one.";
  return "That confirmation link does not work. Send a new one.";
}

/**
 * Shows an invitation to the signed-in user and accepts it. Only the invited
 * address may join, and only once it is confirmed: until then the page says
 * so and offers to mail the confirmation link, which leads back here.
 */
export function AcceptInvitation({ invitationId, email, linkError }: AcceptInvitationProps) {
  const router = useRouter();
  const [load, setLoad] = useState<Load>({ state: "loading" });
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState(false);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    let live = true;
    authClient.organization.getInvitation({ query: { id: invitationId } }).then(({ data, error: err }) => {
      if (!live) return;
      if (!err) setLoad({ state: "ready", invitation: data as InvitationView });
      else if (UNCONFIRMED.has(authErrorCode(err))) setLoad({ state: "unconfirmed" });
      else if (err.status === 400 || err.status === 404 || err.status === 422)
        setLoad({ state: "failed", message: "This invitation has expired, was withdrawn or was already used." });
      else setLoad({ state: "failed", message: authErrorMessage(err) });
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
      if (UNCONFIRMED.has(authErrorCode(err))) setLoad({ state: "unconfirmed" });
      else setError(authErrorMessage(err));
      return;
    }
    router.replace("/home");
    router.refresh();
  }

  async function sendLink() {
    setBusy(true);
    setError(null);
    const { error: err } = await authClient.sendVerificationEmail({ email, callbackURL: `/invitations/${invitationId}` });
    setBusy(false);
    if (err) setError(authErrorMessage(err));
    else setSent(true);
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
      {load.state === "failed" ? (
        <FormMessage tone="error" message={load.message} />
      ) : load.state === "loading" ? (
        <p role="status" className="text-sm text-muted">
          Loading the invitation…
        </p>
      ) : load.state === "unconfirmed" ? (
        <div className="flex flex-col gap-3">
          <h2 className="text-base font-semibold">Confirm your e-mail address first</h2>
          <p className="text-sm">
            Only the address an invitation was sent to can join, and only once it is confirmed. {email} is not confirmed yet: we
            mail a link to it, and opening that link brings you back here to join.
          </p>
          <FormMessage tone="error" message={error ?? linkErrorWords(linkError)} />
          <FormMessage tone="info" message={sent ? `A confirmation link is on its way to ${email}. Open it from that mailbox.` : null} />
          <Button variant="primary" onClick={sendLink} busy={busy}>
            {sent ? "Send the link again" : "Send the confirmation link"}
          </Button>
        </div>
      ) : (
        <div className="flex flex-col gap-3">
          <p className="text-sm">
            {load.invitation.inviterEmail ?? "A team admin"} invites you to join <strong>{load.invitation.organizationName ?? "a team"}</strong>{" "}
            as <strong>{load.invitation.role ?? "member"}</strong>.
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
