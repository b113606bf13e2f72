import { timestamp, varchar } from "drizzle-orm/mysql-core";

/** A random UUID primary key, so ids in URLs reveal nothing about other records. */
export const uuidPk = () =>
  varchar("id", { length: 36 })
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());

export const createdAt = () => timestamp("created_at", { fsp: 3 }).defaultNow().notNull();
export const updatedAt = () =>
  timestamp("updated_at", { fsp: 3 })
    .defaultNow()
    .$onUpdate(() => new Date())
    .notNull();

/** A reference to a team (better-auth organization) id. */
export const teamRef = () => varchar("team_id", { length: 36 }).notNull();
/** A reference to a user id. */
export const userRef = (name: string) => varchar(name, { length: 36 });
