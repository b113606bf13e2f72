import { defineConfig } from "drizzle-kit";
import { databaseUrl } from "./db/config";

export default defineConfig({
  dialect: "mysql",
  schema: "./db/schema/index.ts",
  out: "./db/migrations",
  dbCredentials: { url: databaseUrl() },
  strict: true,
  verbose: true,
});
