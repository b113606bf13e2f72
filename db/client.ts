import { drizzle } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { databaseUrl } from "./config";
import * as schema from "./schema";

/**
 * Builds a pooled Drizzle client. The app uses the one in db/index.ts;
 * scripts (migrate, seed) and tests build their own with this.
 */
export function createDb(url: string = databaseUrl(), poolSize = 10) {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: poolSize,
    // Fail fast when MariaDB is down, so requests get a clear 503 instead of hanging.
    connectTimeout: 3_000,
    enableKeepAlive: true,
    timezone: "Z",
    dateStrings: false,
  });
  const db = drizzle(pool, { schema, mode: "default" });
  return { db, pool };
}

export type Db = ReturnType<typeof createDb>["db"];
/** A Drizzle transaction handle, for functions that take either. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;
