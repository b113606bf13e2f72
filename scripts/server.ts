/**
 * Gelwright's HTTP server: Node's own server with Next.js behind it. Every
 * request passes the front first (lib/server/front.ts): the client's address
 * (X-Forwarded-For only from GELWRIGHT_TRUSTED_PROXIES), byte limits enforced
 * while the body streams in, same-origin JSON for every change, and a script
 * nonce per page. Always serve the app through this file, never `next start`.
 *
 *   tsx scripts/server.ts [--dev] [--hostname localhost] [--port 3000]
 */
import { createServer } from "node:http";
import { parseArgs } from "node:util";
import { createFront } from "@/lib/server/front";
import { SettingsError, startSettings, type Settings } from "@/lib/settings";

const { values } = parseArgs({
  options: {
    dev: { type: "boolean", default: false },
    // Without these, HOSTNAME and PORT from the environment (see lib/settings.ts).
    hostname: { type: "string", short: "H" },
    port: { type: "string", short: "p" },
  },
});
const dev = values.dev ?? false;
if (values.port !== undefined && !/^\d{1,5}$/.test(values.port)) {
  console.error(`[server] --port: “${values.port}” is not a port number (1–65535).`);
  process.exit(1);
}

/** Every setting is checked before anything listens; a bad one stops the start with all problems listed. */
function checkedSettings(): Settings {
  try {
    return startSettings({ NODE_ENV: dev ? "development" : "production", PORT: values.port, HOSTNAME: values.hostname });
  } catch (err) {
    if (err instanceof SettingsError) {
      console.error(`[server] ${err.message}`);
      process.exit(1);
    }
    throw err;
  }
}

async function main(): Promise<void> {
  const { server: serverSettings } = checkedSettings();
  const { hostname, port } = serverSettings;
  const prepare = createFront(serverSettings, { dev });
  const { default: next } = await import("next");
  const server = createServer();
  const app = next({ dev, hostname, port, httpServer: server });
  const handle = app.getRequestHandler();
  await app.prepare();
  server.on("request", (req, res) => {
    try {
      if (prepare(req, res)) void handle(req, res);
    } catch (err) {
      console.error("[server] request failed before the app:", err);
      if (!res.headersSent) {
        res.writeHead(500, { "content-type": "application/json" });
        res.end(JSON.stringify({ error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." } }));
      }
    }
  });
  // A client that sends its headers slowly is not kept waiting for ever.
  server.headersTimeout = 20_000;
  server.requestTimeout = 120_000;
  server.listen(port, hostname, () => {
    console.log(`[server] Gelwright ${dev ? "(development) " : ""}on http://${hostname}:${port}`);
  });
  const stop = () => server.close(() => process.exit(0));
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err: unknown) => {
  console.error("[server] could not start:", err);
  process.exit(1);
});
