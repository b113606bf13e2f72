/**
 * The life of a revision through the HTTP API, with the rules of
 * DEVELOPERS.md "Lifecycle": stale saves, self-approval, thermal fail,
 * immutability of approved work, audit events and mails.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { coatInput, library, type LibraryMaterial } from "./fixtures";
import { demo, signIn, signUp, verifyAddress, type Client } from "./http";
import { waitForMail } from "./mailbox";

let formulator: Client, reviewer: Client, production: Client, admin: Client;
let lib: Map<string, LibraryMaterial>;
const stamp = Date.now().toString(36);

beforeAll(async () => {
  [formulator, reviewer, production, admin] = await Promise.all([
    signIn(demo.formulator),
    signIn(demo.reviewer),
    signIn(demo.production),
    signIn(demo.admin),
  ]);
  lib = await library(formulator);
});

async function json<T = Record<string, unknown>>(res: Response): Promise<T> {
  return (await res.json()) as T;
}

async function create(name: string, input = coatInput(lib)) {
  const res = await formulator.fetch("/api/formulations", { method: "POST", json: { name, project: "Test", input } });
  expect(res.status).toBe(201);
  return json<{ formulationId: string; revisionId: string }>(res);
}

async function revision(client: Client, id: string) {
  return json<{ state: string; version: number; input: unknown; result: { thermal: { status: string } } | null }>(
    await client.fetch(`/api/revisions/${id}`),
  );
}

describe("revision lifecycle over HTTP", () => {
  it("saves a draft with its version counter and refuses a stale save with 409, overwriting nothing", async () => {
    const { revisionId } = await create(`Stale save ${stamp}`);
    const v1 = await revision(formulator, revisionId);
    expect(v1.version).toBe(1);
    const mine = coatInput(lib, { teos: 0.5 });
    const theirs = coatInput(lib, { teos: 0.3 });
    const first = await formulator.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version: 1, input: mine } });
    expect(first.status).toBe(200);
    expect((await json<{ version: number }>(first)).version).toBe(2);
    const stale = await formulator.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version: 1, input: theirs } });
    expect(stale.status).toBe(409);
    const body = await json<{ error: { code: string; message: string } }>(stale);
    expect(body.error.code).toBe("conflict");
    expect(body.error.message).toMatch(/reload/i);
    const after = await revision(formulator, revisionId);
    expect(after.version).toBe(2);
    expect(after.input).toEqual(mine);
  });

  it("takes a revision through review: return needs a comment, the author is told, approval is immutable, release reaches production", async () => {
    const name = `Lifecycle ${stamp}`;
    const { formulationId, revisionId } = await create(name);
    expect((await formulator.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
    await waitForMail(demo.reviewer, new RegExp(`review.*${name}`));

    // The revision names everyone who wrote or changed it, so the review page can hold back its approve button for them.
    const session = (await (await formulator.fetch("/api/auth/get-session")).json()) as { user: { id: string } };
    expect((await json<{ authorIds: string[] }>(await reviewer.fetch(`/api/revisions/${revisionId}`))).authorIds).toContain(session.user.id);

    // A formulator cannot review at all; production cannot see work in review.
    expect((await formulator.fetch(`/api/revisions/${revisionId}/approve`, { method: "POST", json: {} })).status).toBe(403);
    expect((await production.fetch(`/api/revisions/${revisionId}`)).status).toBe(404);

    const noComment = await reviewer.fetch(`/api/revisions/${revisionId}/return`, { method: "POST", json: {} });
    expect(noComment.status).toBe(422);
    expect((await json<{ error: { fields: Record<string, string> } }>(noComment)).error.fields.comment).toMatch(/comment/i);

    const returned = await reviewer.fetch(`/api/revisions/${revisionId}/return`, {
      method: "POST",
      json: { comment: "Raise the water ratio to 2.5." },
    });
    expect(returned.status).toBe(200);
    expect((await revision(formulator, revisionId)).state).toBe("draft");
    const mail = await waitForMail(demo.formulator, new RegExp(`${name}.*sent back`));
    expect(mail.text).toContain("Raise the water ratio to 2.5.");

    const input = coatInput(lib);
    input.water.value = 2.5;
    expect((await formulator.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version: 1, input } })).status).toBe(200);
    expect((await formulator.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
    const approved = await reviewer.fetch(`/api/revisions/${revisionId}/approve`, { method: "POST", json: {} });
    expect(approved.status).toBe(200);
    await waitForMail(demo.formulator, new RegExp(`${name}.*approved`));

    // Approved work never changes: a save is refused, and editing starts revision 2.
    const edit = await formulator.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version: 2, input: coatInput(lib) } });
    expect(edit.status).toBe(409);
    const next = await formulator.fetch(`/api/formulations/${formulationId}/revisions`, { method: "POST", json: {} });
    expect(next.status).toBe(201);
    const { revisionId: rev2, number } = await json<{ revisionId: string; number: number }>(next);
    expect(number).toBe(2);
    const changed = coatInput(lib, { teos: 0.45 });
    changed.water.value = 2.5;
    expect((await formulator.fetch(`/api/revisions/${rev2}`, { method: "PUT", json: { version: 1, input: changed } })).status).toBe(200);
    const diff = await json<{ input: { path: string; before: unknown; after: unknown }[]; results: { path: string }[] }>(
      await formulator.fetch(`/api/formulations/${formulationId}/diff?from=1&to=2`),
    );
    const teosName = lib.get("teos")!.name;
    expect(diff.input).toContainEqual({ path: `components.${teosName}`, before: 0.4, after: 0.45 });
    expect(diff.results.some((d) => d.path.startsWith("lines."))).toBe(true);
    expect((await revision(formulator, revisionId)).state).toBe("approved");

    // Release of revision 1: production sees it and is told.
    expect((await production.fetch(`/api/formulations/${formulationId}`)).status).toBe(404);
    expect((await reviewer.fetch(`/api/revisions/${revisionId}/release`, { method: "POST", json: {} })).status).toBe(200);
    await waitForMail(demo.production, new RegExp(`Released.*${name}`));
    const seen = await json<{ revisions: { id: string; state: string }[] }>(await production.fetch(`/api/formulations/${formulationId}`));
    expect(seen.revisions.map((r) => r.id)).toEqual([revisionId]);
    expect((await production.fetch(`/api/revisions/${rev2}`)).status).toBe(404);

    // Every transition left an audit event.
    const audit = await json<{ rows: { action: string }[] }>(await admin.fetch(`/api/audit?entityId=${revisionId}&pageSize=50`));
    expect(audit.rows.map((r) => r.action).sort()).toEqual(
      ["revision.approved", "revision.released", "revision.returned", "revision.saved", "revision.submitted", "revision.submitted"].sort(),
    );
  });

  it("refuses to approve a thermal fail and asks for a comment on a caution", async () => {
    const fail = await create(`Too hot ${stamp}`, coatInput(lib, { cureC: 400 }));
    const failRev = await revision(formulator, fail.revisionId);
    expect(failRev.result?.thermal.status).toBe("fail");
    expect((await formulator.fetch(`/api/revisions/${fail.revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
    const refused = await reviewer.fetch(`/api/revisions/${fail.revisionId}/approve`, { method: "POST", json: { comment: "ok" } });
    expect(refused.status).toBe(422);
    expect((await json<{ error: { code: string } }>(refused)).error.code).toBe("thermal_fail");
    expect((await revision(reviewer, fail.revisionId)).state).toBe("in_review");

    // Polycarbonate: heat deflection temperature 132 °C less the 20 °C margin = 112 °C; 120 °C is within the margin.
    const near = await create(`Near the limit ${stamp}`, coatInput(lib, { cureC: 120 }));
    expect((await revision(formulator, near.revisionId)).result?.thermal.status).toBe("caution");
    expect((await formulator.fetch(`/api/revisions/${near.revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);
    const bare = await reviewer.fetch(`/api/revisions/${near.revisionId}/approve`, { method: "POST", json: {} });
    expect(bare.status).toBe(422);
    expect((await json<{ error: { fields: Record<string, string> } }>(bare)).error.fields.comment).toMatch(/caution/);
    const withComment = await reviewer.fetch(`/api/revisions/${near.revisionId}/approve`, {
      method: "POST",
      json: { comment: "110 °C for 2 h is inside the visor grade's rating." },
    });
    expect(withComment.status).toBe(200);
  });

  it("never lets a reviewer decide on a revision they wrote", async () => {
    // A new member joins by invitation as formulator, writes a draft, then becomes a reviewer.
    const email = `switcher-${stamp}@larkspur.example`;
    const invite = await admin.fetch("/api/invitations", { method: "POST", json: { email, role: "formulator" } });
    expect(invite.status).toBe(201);
    const { id: invitationId } = await json<{ id: string }>(invite);
    const mail = await waitForMail(email, /invited/i);
    expect(mail.text).toContain(`/invitations/${invitationId}`);
    // Joining needs the invited address confirmed by the mailed link.
    const newcomer = await verifyAddress(await signUp(email, "Sam Switcher"), email);
    const accepted = await newcomer.fetch("/api/auth/organization/accept-invitation", { method: "POST", json: { invitationId } });
    expect(accepted.status).toBe(200);

    const res = await newcomer.fetch("/api/formulations", {
      method: "POST",
      json: { name: `Own work ${stamp}`, input: coatInput(await library(newcomer)) },
    });
    expect(res.status).toBe(201);
    const { revisionId } = await json<{ revisionId: string }>(res);
    expect((await newcomer.fetch(`/api/revisions/${revisionId}/submit`, { method: "POST", json: {} })).status).toBe(200);

    const members = await json<{ rows: { id: string; email: string }[] }>(await admin.fetch("/api/members"));
    const me = members.rows.find((m) => m.email === email)!;
    expect((await admin.fetch(`/api/members/${me.id}`, { method: "PATCH", json: { role: "reviewer" } })).status).toBe(200);

    const own = await newcomer.fetch(`/api/revisions/${revisionId}/approve`, { method: "POST", json: { comment: "fine" } });
    expect(own.status).toBe(422);
    expect((await json<{ error: { code: string } }>(own)).error.code).toBe("own_revision");
    const ownReturn = await newcomer.fetch(`/api/revisions/${revisionId}/return`, { method: "POST", json: { comment: "x" } });
    expect(ownReturn.status).toBe(422);
    expect((await revision(reviewer, revisionId)).state).toBe("in_review");
  });

  it("keeps at least one admin in the team", async () => {
    const members = await json<{ rows: { id: string; role: string; email: string }[] }>(await admin.fetch("/api/members"));
    const self = members.rows.find((m) => m.email === demo.admin)!;
    const admins = members.rows.filter((m) => m.role === "admin");
    expect(admins).toHaveLength(1);
    expect((await admin.fetch(`/api/members/${self.id}`, { method: "PATCH", json: { role: "formulator" } })).status).toBe(409);
    expect((await admin.fetch(`/api/members/${self.id}`, { method: "DELETE" })).status).toBe(409);
  });

  it("sends a password-reset mail with a link", async () => {
    const res = await formulator.fetch("/api/auth/request-password-reset", {
      method: "POST",
      json: { email: demo.production, redirectTo: "/reset-password" },
    });
    expect(res.status).toBe(200);
    const mail = await waitForMail(demo.production, /reset/i);
    expect(mail.text).toMatch(/reset-password/);
  });
});
