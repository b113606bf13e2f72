/**
 * npm run db:backup [FILE]   — dumps the database (DATABASE_URL or the private MariaDB) to FILE
 *                              (default .data/backups/<db>-<timestamp>.sql)
 * npm run db:restore FILE    — loads FILE into that database (its tables are replaced)
 * Uses Debian's mariadb-dump and mariadb clients; the password goes through MYSQL_PWD, never argv.
 */
import { spawn } from "node:child_process";
import { createReadStream, createWriteStream, existsSync, mkdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { databaseUrl } from "../db/config";

function connection() {
  const url = new URL(databaseUrl());
  return {
    args: ["--no-defaults", `--host=${url.hostname}`, `--port=${url.port || "3306"}`, `--user=${decodeURIComponent(url.username)}`],
    env: { ...process.env, MYSQL_PWD: decodeURIComponent(url.password) },
    database: url.pathname.slice(1),
  };
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv, stdin?: NodeJS.ReadableStream, stdout?: NodeJS.WritableStream) {
  return new Promise<void>((resolve, reject) => {
    const child = spawn(cmd, args, { env, stdio: [stdin ? "pipe" : "ignore", stdout ? "pipe" : "inherit", "pipe"] });
    let err = "";
    child.stderr?.on("data", (d: Buffer) => (err += d.toString()));
    if (stdin && child.stdin) stdin.pipe(child.stdin);
    if (stdout && child.stdout) child.stdout.pipe(stdout);
    child.on("error", reject);
    child.on("close", (code) => (code === 0 ? resolve() : reject(new Error(`${cmd} exited ${code}: ${err.trim()}`))));
  });
}

export async function backup(file?: string): Promise<string> {
  const c = connection();
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const out = file ?? join(".data", "backups", `${c.database}-${stamp}.sql`);
  mkdirSync(dirname(out), { recursive: true });
  const stream = createWriteStream(out);
  await run(
    "mariadb-dump",
    [...c.args, "--single-transaction", "--routines", "--triggers", "--hex-blob", "--default-character-set=utf8mb4", c.database],
    c.env,
    undefined,
    stream,
  );
  await new Promise((r) => stream.end(r));
  return out;
}

export async function restore(file: string): Promise<void> {
  if (!existsSync(file)) throw new Error(`No such backup file: ${file}`);
  const c = connection();
  await run("mariadb", [...c.args, "--default-character-set=utf8mb4", c.database], c.env, createReadStream(file));
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const [mode, file] = process.argv.slice(2);
  const job = mode === "restore" ? restore(file ?? "").then(() => `restored ${file}`) : backup(file).then((f) => `backup written to ${f}`);
  job
    .then((msg) => console.log(`[gelwright] ${msg}`))
    .catch((err: unknown) => {
      console.error(`[gelwright] ${err instanceof Error ? err.message : err}`);
      process.exit(1);
    });
}
