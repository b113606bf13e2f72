/**
 * No secret reaches the browser: the client bundle that `next build` produced
 * (.next/static) holds neither the session-signing secret nor the database
 * password, nor any server-only setting name with its value.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    return statSync(full).isDirectory() ? files(full) : [full];
  });
}

describe("client bundle", () => {
  it("contains no secret", () => {
    const secrets = [
      process.env.BETTER_AUTH_SECRET,
      process.env.GELWRIGHT_DB_PASSWORD ?? "gelwright-local",
      process.env.S3_SECRET_ACCESS_KEY === "S3RVER" ? undefined : process.env.S3_SECRET_ACCESS_KEY,
      "gelwright-local-development-secret",
    ].filter((s): s is string => Boolean(s));
    const bundle = files(join(process.cwd(), ".next", "static")).filter((f) => /\.(js|css|html|json)$/.test(f));
    expect(bundle.length).toBeGreaterThan(5);
    const leaks: string[] = [];
    for (const f of bundle) {
      const text = readFileSync(f, "utf8");
      for (const s of secrets) if (text.includes(s)) leaks.push(`${f} contains a secret`);
      if (/mysql:\/\/[^"'\s]+:[^"'\s]+@/.test(text)) leaks.push(`${f} contains a database URL with a password`);
    }
    expect(leaks).toEqual([]);
  });
});
