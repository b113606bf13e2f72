/**
 * Two app instances on two ports against one database (scripts/test.sh starts
 * both): a session made on one is valid on the other, and data written
 * through one is read through the other. The app keeps no state of its own.
 */
import { describe, expect, it } from "vitest";
import { coatInput, library } from "./fixtures";
import { BASE, demo, signIn } from "./http";

const SECOND = `http://localhost:${process.env.TEST_APP_PORT2 ?? 3101}`;

describe("two app instances, one database", () => {
  it("serve the same sessions and the same data", async () => {
    const onA = await signIn(demo.formulator);
    const viaB = (path: string, init: RequestInit = {}) =>
      fetch(`${SECOND}${path}`, {
        ...init,
        headers: { cookie: onA.cookie, origin: BASE, "content-type": "application/json", "x-forwarded-for": onA.ip },
      });
    const name = `Two instances ${Date.now().toString(36)}`;
    const created = await viaB("/api/formulations", {
      method: "POST",
      body: JSON.stringify({ name, input: coatInput(await library(onA)) }),
    });
    expect(created.status).toBe(201);
    const { formulationId } = (await created.json()) as { formulationId: string };
    const readOnA = await onA.fetch(`/api/formulations/${formulationId}`);
    expect(readOnA.status).toBe(200);
    expect(((await readOnA.json()) as { name: string }).name).toBe(name);
    const session = (await (await viaB("/api/auth/get-session")).json()) as { user: { email: string } };
    expect(session.user.email).toBe(demo.formulator);
  });
});
