/**
 * Mail and team membership against takeover: the captured mailbox shows a
 * team only its own business (never password-reset or address mail, never
 * another team's invitation), an invitation is accepted only by its verified
 * address, the sign-in library's own membership routes are closed, and its
 * errors come back in our error shape.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { anonymous, demo, signIn, signUp, verifyAddress, type Client } from "./http";
import { capturedMails, waitForMail } from "./mailbox";

interface MailRow {
  to: string[];
  subject: string;
  text: string;
}
interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

const stamp = Date.now().toString(36);
let admin: Client;

async function mailbox(client: Client): Promise<MailRow[]> {
  const res = await client.fetch("/api/mailbox");
  expect(res.status).toBe(200);
  return ((await res.json()) as { rows: MailRow[] }).rows;
}

/** A new account with a team of its own, as anyone can make. */
async function ownTeam(prefix: string): Promise<{ client: Client; email: string; team: string }> {
  const email = `${prefix}-${stamp}@elsewhere.example`;
  const client = await signUp(email, "Mallory Outsider");
  const team = `Outsider Lab ${prefix} ${stamp}`;
  const res = await client.fetch("/api/teams", { method: "POST", json: { name: team } });
  expect(res.status).toBe(201);
  return { client, email, team };
}

beforeAll(async () => {
  admin = await signIn(demo.admin);
});

describe("the captured mailbox", () => {
  it("never shows a password-reset mail, not even to a team that invited the address", async () => {
    const attacker = await ownTeam("mallory");
    const invited = await attacker.client.fetch("/api/invitations", { method: "POST", json: { email: demo.reviewer, role: "formulator" } });
    expect(invited.status).toBe(201);
    const before = Date.now();
    const reset = await anonymous().fetch("/api/auth/request-password-reset", {
      method: "POST",
      json: { email: demo.reviewer, redirectTo: "/reset-password" },
    });
    expect(reset.status).toBe(200);
    // The reset mail did go out (to the reviewer's own inbox) …
    const sent = await waitForMail(demo.reviewer, /reset/i, 5_000, before - 1_000);
    expect(sent.kind).toBe("account");

    // … but no team's mailbox shows it: neither the attacker's nor the reviewer's own team.
    for (const box of [await mailbox(attacker.client), await mailbox(admin)]) {
      expect(box.filter((m) => /reset/i.test(m.subject) || /reset-password/.test(m.text))).toEqual([]);
    }
    // The attacker sees their own invitation and nothing else sent to that address.
    const toReviewer = (await mailbox(attacker.client)).filter((m) => m.to.includes(demo.reviewer));
    expect(toReviewer.map((m) => m.subject)).toEqual([`You are invited to ${attacker.team} on Gelwright`]);
  });

  it("shows a team only its own invitations, not another team's to the same address", async () => {
    const email = `shared-${stamp}@elsewhere.example`;
    expect((await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "admin" } })).status).toBe(201);
    const attacker = await ownTeam("eve");
    expect((await attacker.client.fetch("/api/invitations", { method: "POST", json: { email, role: "production" } })).status).toBe(201);
    await waitForMail(email, new RegExp(attacker.team));

    const seen = (await mailbox(attacker.client)).filter((m) => m.to.includes(email));
    expect(seen.map((m) => m.subject)).toEqual([`You are invited to ${attacker.team} on Gelwright`]);
    expect(JSON.stringify(await mailbox(attacker.client))).not.toMatch(/Larkspur/);
    const larkspur = (await mailbox(admin)).filter((m) => m.to.includes(email));
    expect(larkspur.map((m) => m.subject)).toEqual(["You are invited to Larkspur Coatings Lab on Gelwright"]);
  });

  it("tags every mail the app sends with its team and kind, and mail about an account with no team", async () => {
    const mails = capturedMails();
    expect(mails.length).toBeGreaterThan(0);
    for (const m of mails) {
      expect(["team", "account"], m.subject).toContain(m.kind);
      if (m.kind === "account") expect(m.team ?? null, m.subject).toBeNull();
      else expect(m.team, m.subject).toMatch(/\S/);
    }
  });

  describe("edge cases", () => {
    it("never shows the address-confirmation mail", async () => {
      const email = `confirm-${stamp}@larkspur.example`;
      expect((await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "formulator" } })).status).toBe(201);
      const newcomer = await signUp(email, "Cora Confirm");
      await verifyAddress(newcomer, email);
      const box = (await mailbox(admin)).filter((m) => m.to.includes(email));
      expect(box.map((m) => m.subject)).toEqual(["You are invited to Larkspur Coatings Lab on Gelwright"]);
    });
  });
});

describe("accepting an invitation", () => {
  it("refuses an account whose address is not verified, then lets the verified address join with the given role", async () => {
    const email = `joiner-${stamp}@larkspur.example`;
    const invite = await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "reviewer" } });
    expect(invite.status).toBe(201);
    const { id: invitationId } = (await invite.json()) as { id: string };

    const unverified = await signUp(email, "Jo Joiner");
    const shown = await unverified.fetch(`/api/auth/organization/get-invitation?id=${invitationId}`);
    expect(shown.status).toBe(403);
    const refused = await unverified.fetch("/api/auth/organization/accept-invitation", { method: "POST", json: { invitationId } });
    expect(refused.status).toBe(403);
    const body = (await refused.json()) as ErrorBody;
    expect(body.error.code).toBe("email_verification_required_before_accepting_or_rejecting_invitation");
    expect(body.error.message).toMatch(/verif/i);
    let members = (await (await admin.fetch("/api/members")).json()) as { rows: { email: string; role: string }[] };
    expect(members.rows.map((m) => m.email)).not.toContain(email);

    const verified = await verifyAddress(unverified, email);
    expect((await verified.fetch(`/api/auth/organization/get-invitation?id=${invitationId}`)).status).toBe(200);
    const accepted = await verified.fetch("/api/auth/organization/accept-invitation", { method: "POST", json: { invitationId } });
    expect(accepted.status).toBe(200);
    members = (await (await admin.fetch("/api/members")).json()) as { rows: { email: string; role: string }[] };
    expect(members.rows).toContainEqual(expect.objectContaining({ email, role: "reviewer" }));
    // Joining is in the team's activity log, like every other membership change.
    const audit = (await (await admin.fetch("/api/audit?action=member.joined&pageSize=200")).json()) as {
      rows: { action: string; summary: { after?: { email?: string; role?: string } } | null }[];
    };
    expect(audit.rows.map((r) => r.summary?.after)).toContainEqual({ email, role: "reviewer" });
  });

  describe("edge cases", () => {
    it("refuses a verified account of another address, and the invitation stays open for its own", async () => {
      const email = `meant-${stamp}@larkspur.example`;
      const invite = await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "admin" } });
      const { id: invitationId } = (await invite.json()) as { id: string };
      const otherEmail = `other-${stamp}@elsewhere.example`;
      const other = await verifyAddress(await signUp(otherEmail, "Oscar Other"), otherEmail);
      const res = await other.fetch("/api/auth/organization/accept-invitation", { method: "POST", json: { invitationId } });
      expect(res.status).toBe(403);
      expect(((await res.json()) as ErrorBody).error.code).toBe("you_are_not_the_recipient_of_the_invitation");
      const pending = (await (await admin.fetch("/api/invitations")).json()) as { rows: { id: string; status: string }[] };
      expect(pending.rows.find((r) => r.id === invitationId)?.status).toBe("pending");
    });

    it("answers a signed-out caller with 401 in our error shape", async () => {
      const res = await anonymous().fetch("/api/auth/organization/accept-invitation", { method: "POST", json: { invitationId: "x" } });
      expect(res.status).toBe(401);
      expect(((await res.json()) as ErrorBody).error.code).toMatch(/\w/);
    });
  });
});

describe("the sign-in library's own team routes", () => {
  it("refuses a role change through them, in our error shape, and the role stays as it was", async () => {
    const members = (await (await admin.fetch("/api/members")).json()) as { rows: { id: string; email: string; role: string }[] };
    const production = members.rows.find((m) => m.email === demo.production)!;
    for (const role of ["owner", "admin"]) {
      const res = await admin.fetch("/api/auth/organization/update-member-role", { method: "POST", json: { memberId: production.id, role } });
      expect(res.status).toBe(404);
      const body = (await res.json()) as ErrorBody;
      expect(body.error.code).toBe("not_found");
      expect(body.error.message).toMatch(/\/api\/members/);
    }
    const after = (await (await admin.fetch("/api/members")).json()) as { rows: { id: string; role: string }[] };
    expect(after.rows.find((m) => m.id === production.id)?.role).toBe("production");
  });

  it("refuses adding, removing and inviting members through them, and changes nothing", async () => {
    const before = await (await admin.fetch("/api/members")).json();
    const members = before as { rows: { id: string; email: string }[] };
    const reviewer = members.rows.find((m) => m.email === demo.reviewer)!;
    const calls: [string, unknown][] = [
      ["/api/auth/organization/remove-member", { memberIdOrEmail: reviewer.id }],
      ["/api/auth/organization/invite-member", { email: `sneak-${stamp}@elsewhere.example`, role: "admin" }],
      ["/api/auth/organization/leave", { organizationId: "x" }],
      ["/api/auth/organization/delete", { organizationId: "x" }],
      ["/api/auth/organization/set-active", { organizationId: null }],
      ["/api/auth/update-user", { name: "Renamed" }],
      ["/api/auth/change-email", { newEmail: `sneak-${stamp}@elsewhere.example` }],
    ];
    for (const [path, json] of calls) {
      const res = await admin.fetch(path, { method: "POST", json });
      expect(res.status, path).toBe(404);
      expect(((await res.json()) as ErrorBody).error.code, path).toBe("not_found");
    }
    expect(await (await admin.fetch("/api/members")).json()).toEqual(before);
  });
});

describe("the sign-in library's errors", () => {
  it("answers a wrong password with 401 in our error shape", async () => {
    const res = await anonymous().fetch("/api/auth/sign-in/email", { method: "POST", json: { email: demo.reviewer, password: "not-the-password-1" } });
    expect(res.status).toBe(401);
    const body = (await res.json()) as ErrorBody;
    expect(body).toEqual({ error: { code: "invalid_email_or_password", message: expect.stringMatching(/password/i) } });
  });

  it("answers a malformed sign-up with 422 in our error shape", async () => {
    const res = await anonymous().fetch("/api/auth/sign-up/email", { method: "POST", json: { email: "not-an-address", password: "x", name: "" } });
    expect(res.status).toBe(422);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.code).toMatch(/\w/);
    expect(body.error.message).toMatch(/\w/);
  });
});
