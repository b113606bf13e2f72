import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", ".tmp/**", "db/migrations/**", "next-env.d.ts"],
  },
  {
    // The engine is pure TypeScript: no framework, database or auth imports.
    files: ["lib/formulation/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react-dom", "react/*"], message: "lib/formulation is framework-free." },
            { group: ["@/db", "@/db/*", "**/db/*", "drizzle-orm", "drizzle-orm/*", "mysql2", "mysql2/*"], message: "lib/formulation never reads the database." },
            { group: ["better-auth", "better-auth/*", "@/lib/auth*", "**/lib/auth*"], message: "lib/formulation knows nothing of auth." },
            { group: ["server-only", "node:*"], message: "lib/formulation runs in the browser too." },
          ],
        },
      ],
    },
  },
  {
    // Batch-record arithmetic is pure too: no framework, database, auth or spreadsheet.
    files: ["lib/batches/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react-dom", "react/*", "server-only"], message: "lib/batches is framework-free." },
            { group: ["@/db", "@/db/*", "**/db/*", "drizzle-orm", "drizzle-orm/*", "mysql2", "mysql2/*"], message: "lib/batches never reads the database." },
            { group: ["better-auth", "better-auth/*", "@/lib/auth*", "@/lib/api", "@/lib/spreadsheet/*", "xlsx"], message: "lib/batches knows nothing of auth, HTTP or sheets." },
          ],
        },
      ],
    },
  },
  {
    // One module reads the environment (lib/settings.ts): every setting is checked
    // at start and typed; nowhere else may a variable turn into NaN or a silent default.
    files: ["**/*.{ts,tsx,js,mjs}"],
    ignores: [
      "lib/settings.ts",
      // Tests set up environments for the app and child processes they start.
      "tests/**",
      "**/*.test.ts",
      // Standalone development tools, never part of the app: the local stand-ins
      // for hosted services, the benchmarks and the load run take their own
      // options from the environment, and the backup passes it on to mariadb-dump.
      "scripts/fake-*.ts",
      "scripts/bench-*.ts",
      "scripts/load.ts",
      "scripts/db-backup.ts",
    ],
    rules: {
      "no-restricted-properties": [
        "error",
        { object: "process", property: "env", message: "Read settings through settings() from lib/settings.ts (checked at start, typed)." },
      ],
    },
  },
];

export default config;
