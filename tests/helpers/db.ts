/**
 * A fresh MariaDB database per test file, on the instance that scripts/test.sh
 * started (or the one DATABASE_URL names), migrated with the committed migrations.
 */
import mysql from "mysql2/promise";
import { createDb, type Db } from "@/db/client";
import { databaseUrl } from "@/db/config";
import { runMigrations } from "@/db/migrate";

export interface TestDatabase {
  name: string;
  url: string;
  db: Db;
  close: () => Promise<void>;
}

export async function createTestDatabase(label: string): Promise<TestDatabase> {
  const base = new URL(databaseUrl());
  // Named after the configured database, so the app user's grant on "<db>_%" covers it.
  const name = `${base.pathname.slice(1)}_${label.replace(/\W/g, "_")}_${Math.random().toString(36).slice(2, 8)}`;
  const admin = await mysql.createConnection({ uri: `${base.protocol}//${base.username}:${base.password}@${base.host}/` });
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.end();
  const url = `${base.protocol}//${base.username}:${base.password}@${base.host}/${name}`;
  await runMigrations(url);
  const { db, pool } = createDb(url, 4);
  return {
    name,
    url,
    db,
    close: async () => {
      await pool.end();
      const c = await mysql.createConnection({ uri: `${base.protocol}//${base.username}:${base.password}@${base.host}/` });
      await c.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await c.end();
    },
  };
}
