/**
 * Short forms of the load and fault runs (npm run test:load runs the long one):
 * 50 virtual users for 10 s; MariaDB stopped mid-load; concurrent saves of one draft.
 * Latency figures are printed, never asserted.
 */
import { execFileSync } from "node:child_process";
import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { createDb } from "@/db/client";
import { printReport, runLoad } from "../../scripts/load";
import { coatInput, library } from "./fixtures";
import { BASE, demo, signIn } from "./http";

const { db, pool } = createDb(undefined, 2);
afterAll(async () => {
  await pool.end();
});

describe("load, short form", () => {
  it("serves 50 virtual users for 10 s over the usual mix with no errors", async () => {
    const report = await runLoad({ base: BASE, users: 50, seconds: 10 });
    printReport(report, "50 virtual users, 10 s");
    expect(report.requests).toBeGreaterThan(200);
    expect(report.errors).toEqual([]);
  }, 120_000);
});

describe("MariaDB stopped in the middle of the load", () => {
  it("answers 503 with a plain message while it is down, leaves no partial rows, and serves again once it is back", async () => {
    const dbctl = (cmd: string) => execFileSync("bash", ["scripts/db.sh", cmd], { stdio: "pipe", timeout: 60_000 });
    let stopped = false;
    let restarted = false;
    try {
      const report = await runLoad({
        base: BASE,
        users: 10,
        seconds: 12,
        onTick: (t) => {
          if (t >= 4 && !stopped) {
            stopped = true;
            dbctl("stop");
          } else if (t >= 7 && stopped && !restarted) {
            restarted = true;
            dbctl("start");
          }
        },
      });
      printReport(report, "10 virtual users, MariaDB stopped from 4 s to 7 s");
      expect(stopped && restarted).toBe(true);
      const unexpected = report.errors.filter((e) => e.status !== 503);
      expect(unexpected).toEqual([]);
      const outages = report.errors.filter((e) => e.status === 503);
      expect(outages.length).toBeGreaterThan(0);
      for (const e of outages) {
        expect(e.body).toMatch(/"code":"unavailable"/);
        expect(e.body).not.toMatch(/\n\s+at |node_modules/);
      }
    } finally {
      if (!restarted) dbctl("start");
    }
    // Serving again without a restart of the app.
    let status = 0;
    for (let i = 0; i < 40 && status !== 200; i++) {
      status = (await fetch(`${BASE}/api/health`)).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(status).toBe(200);
    const formulator = await signIn(demo.formulator);
    expect((await formulator.fetch("/api/formulations")).status).toBe(200);
    // Every formulation has its first revision: no half-written creations.
    const [rows] = (await db.execute(
      sql`SELECT COUNT(*) AS n FROM formulations f WHERE NOT EXISTS (SELECT 1 FROM revisions r WHERE r.formulation_id = f.id)`,
    )) as unknown as [{ n: number }[]];
    expect(Number(rows[0]!.n)).toBe(0);
  }, 120_000);
});

describe("two people saving the same draft at once", () => {
  it("lets exactly one save win each round; the other gets 409 and no update is lost", async () => {
    const a = await signIn(demo.formulator);
    const b = await signIn(demo.admin);
    const lib = await library(a);
    const created = await a.fetch("/api/formulations", {
      method: "POST",
      json: { name: `Concurrent ${Date.now().toString(36)}`, input: coatInput(lib) },
    });
    const { revisionId } = (await created.json()) as { revisionId: string };
    let version = 1;
    for (let round = 0; round < 15; round++) {
      const inputA = coatInput(lib, { teos: 0.3 + round / 100 });
      const inputB = coatInput(lib, { teos: 0.6 - round / 100 });
      const [ra, rb] = await Promise.all([
        a.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version, input: inputA } }),
        b.fetch(`/api/revisions/${revisionId}`, { method: "PUT", json: { version, input: inputB } }),
      ]);
      const statuses = [ra.status, rb.status].sort();
      expect(statuses, `round ${round}`).toEqual([200, 409]);
      const winner = ra.status === 200 ? inputA : inputB;
      const saved = (await (await a.fetch(`/api/revisions/${revisionId}`)).json()) as { version: number; input: unknown };
      expect(saved.version).toBe(version + 1);
      expect(saved.input).toEqual(winner);
      version = saved.version;
    }
  }, 120_000);
});
