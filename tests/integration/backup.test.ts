import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let source: TestDatabase;
let target: TestDatabase;

beforeAll(async () => {
  source = await createTestDatabase("bk_src");
  target = await createTestDatabase("bk_dst");
  await seedDemo(source.db);
});
afterAll(async () => {
  await source?.close();
  await target?.close();
});

async function dumpTables(t: TestDatabase): Promise<Record<string, unknown[]>> {
  const [tables] = (await t.db.execute(sql`SHOW TABLES`)) as unknown as [Record<string, string>[]];
  const out: Record<string, unknown[]> = {};
  for (const row of tables) {
    const name = Object.values(row)[0]!;
    const [rows] = (await t.db.execute(sql.raw(`SELECT * FROM \`${name}\` ORDER BY 1`))) as unknown as [unknown[]];
    out[name] = rows;
  }
  return out;
}

const cli = (args: string[], url: string) =>
  execFileSync("npx", ["tsx", "scripts/db-backup.ts", ...args], { env: { ...process.env, DATABASE_URL: url }, stdio: "pipe", timeout: 60_000 });

describe("db:backup and db:restore", () => {
  it("restores a backup into a fresh database with every row identical", async () => {
    const file = join(mkdtempSync(join(tmpdir(), "gelwright-backup-")), "backup.sql");
    cli(["backup", file], source.url);
    cli(["restore", file], target.url);
    const [a, b] = [await dumpTables(source), await dumpTables(target)];
    expect(Object.keys(b).sort()).toEqual(Object.keys(a).sort());
    expect((a.formulations ?? []).length).toBeGreaterThan(0);
    expect((a.materials ?? []).length).toBeGreaterThan(30);
    expect(b).toEqual(a);
  });
});
