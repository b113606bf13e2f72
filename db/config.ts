import { settings } from "@/lib/settings";

/**
 * Where the database is: DATABASE_URL, else the private MariaDB that
 * scripts/db.sh starts on loopback (GELWRIGHT_DB_*; see lib/settings.ts).
 */
export function databaseUrl(): string {
  return settings().database.url;
}
