import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { BASE } from "./http";

const db = (cmd: "start" | "stop") => execFileSync("bash", ["scripts/db.sh", cmd], { stdio: "pipe", timeout: 60_000 });

async function health() {
  const res = await fetch(`${BASE}/api/health`);
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

describe("GET /api/health", () => {
  it("answers 200 with the database up", async () => {
    const { status, body } = await health();
    expect(status).toBe(200);
    expect(body).toEqual({ status: "ok", db: "up" });
  });

  it("answers 503 with a plain message while MariaDB is stopped, and 200 again once it is back, without restarting the app", async () => {
    db("stop");
    try {
      const down = await health();
      expect(down.status).toBe(503);
      expect(down.body.db).toBe("down");
      expect(String(down.body.message)).toMatch(/database is not reachable/i);
      expect(JSON.stringify(down.body)).not.toMatch(/at \w+ \(|ECONNREFUSED|stack/i);
    } finally {
      db("start");
    }
    let status = 0;
    for (let i = 0; i < 40 && status !== 200; i++) {
      status = (await health()).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(status).toBe(200);
  });
});
