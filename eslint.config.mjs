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
];

export default config;
