import "server-only";
import { settings } from "@/lib/settings";
import { createDb, type Db } from "./client";

// One client per server process; reused across hot reloads in development.
const globalForDb = globalThis as unknown as { gelwrightDb?: ReturnType<typeof createDb> };
const client = globalForDb.gelwrightDb ?? createDb();
if (settings().nodeEnv !== "production") globalForDb.gelwrightDb = client;

export const db: Db = client.db;
export const pool = client.pool;
