/**
 * Reading MariaDB's own refusals (through mysql2 and Drizzle's `cause`
 * chain) in the domain's words. The unique keys are what keep names unique,
 * not a "does it exist" read first: a clash is MariaDB's duplicate-key error
 * (ER_DUP_ENTRY), turned here into a ConflictError naming the field.
 * Framework-free, so the route layer and the tests can use it too.
 */
import { ConflictError } from "@/lib/errors";

interface MysqlError {
  code?: unknown;
  errno?: unknown;
  sqlMessage?: unknown;
  message?: unknown;
  fatal?: unknown;
  cause?: unknown;
}

/** The MariaDB error (ER_… code) behind `err`, following Drizzle's `cause` chain. */
function mysqlError(err: unknown, code: string, errno: number): MysqlError | null {
  for (let e: unknown = err, i = 0; e && i < 6; i++) {
    const m = e as MysqlError;
    if (m.code === code || m.errno === errno) return m;
    e = m.cause;
  }
  return null;
}

const DB_DOWN_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EPIPE",
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "ER_CON_COUNT_ERROR",
  "ER_SERVER_SHUTDOWN",
  "ER_CONNECTION_KILLED",
]);

/** True when the error (or one of its causes) says MariaDB is unreachable or went away. */
export function isDbUnavailable(err: unknown): boolean {
  for (let e: unknown = err, i = 0; e && i < 6; i++) {
    const { code, fatal, message, cause } = e as MysqlError;
    if (typeof code === "string" && DB_DOWN_CODES.has(code)) return true;
    if (fatal === true) return true;
    if (typeof message === "string" && /connection is in closed state|connection lost|server has gone away/i.test(message)) return true;
    e = cause;
  }
  return false;
}

/**
 * The unique key that a duplicate-key error (ER_DUP_ENTRY, errno 1062) names,
 * "" when it names none, or null when `err` is no such error.
 *
 * @example
 * ```ts
 * duplicateKey(err); // "materials_team_name_uq"
 * ```
 */
export function duplicateKey(err: unknown): string | null {
  const m = mysqlError(err, "ER_DUP_ENTRY", 1062);
  if (!m) return null;
  const text = String(m.sqlMessage ?? m.message ?? "");
  return /for key '(?:[^'.]*\.)?([^']+)'/.exec(text)?.[1] ?? "";
}

/** The column that a value was too long for (ER_DATA_TOO_LONG, errno 1406), or null. */
export function tooLongColumn(err: unknown): string | null {
  const m = mysqlError(err, "ER_DATA_TOO_LONG", 1406);
  if (!m) return null;
  return /for column [`']?([^`' ]+)[`']?/.exec(String(m.sqlMessage ?? m.message ?? ""))?.[1] ?? "body";
}

/** What a clash on each unique key means to the person who sent the request. */
export const UNIQUE_KEYS: Readonly<Record<string, { field: string; message: string }>> = {
  materials_team_name_uq: { field: "material.name", message: "The library already has a material with this name." },
  formulations_team_name_uq: { field: "name", message: "A formulation with this name already exists in this team." },
  lots_team_material_lot_uq: { field: "supplierLot", message: "This material already has a lot with this supplier lot number." },
  revisions_formulation_number_uq: { field: "body", message: "Someone started a revision at the same moment; reload and try again." },
};

/**
 * The ConflictError (code "duplicate") that a duplicate-key error means, or
 * null when `err` is none. `message` replaces the key's general message, e.g.
 * with the name that was taken. The values in MariaDB's own message never
 * reach the answer.
 *
 * @example
 * ```ts
 * duplicateConflict(err)?.fields; // { "material.name": "The library already has a material with this name." }
 * ```
 */
export function duplicateConflict(err: unknown, message?: string): ConflictError | null {
  const key = duplicateKey(err);
  if (key === null) return null;
  const known = UNIQUE_KEYS[key] ?? { field: "body", message: "A record with these values already exists." };
  return new ConflictError("duplicate", message ?? known.message, known.field);
}

/**
 * For `.catch()` on a write: a clash on unique key `key` becomes a
 * ConflictError with `message`; every other error passes unchanged.
 *
 * @example
 * ```ts
 * await tx.insert(materials).values(row).catch(onDuplicate("materials_team_name_uq", `The library already has a material named "${name}".`));
 * ```
 */
export function onDuplicate(key: string, message: string): (err: unknown) => never {
  return (err) => {
    if (duplicateKey(err) === key) throw duplicateConflict(err, message)!;
    throw err;
  };
}
