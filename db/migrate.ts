/** Applies the committed drizzle-kit migrations in db/migrations. */
import { migrate } from "drizzle-orm/mysql2/migrator";
import { createDb } from "./client";
import { databaseUrl } from "./config";

export async function runMigrations(url: string = databaseUrl()): Promise<void> {
  const { db, pool } = createDb(url, 1);
  try {
    await migrate(db, { migrationsFolder: new URL("./migrations", import.meta.url).pathname });
  } finally {
    await pool.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  runMigrations()
    .then(() => console.log("[gelwright] migrations applied"))
    .catch((err: unknown) => {
      console.error("[gelwright] migration failed:", err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
