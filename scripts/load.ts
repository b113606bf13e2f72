/**
 * A bounded load run against a Gelwright server on loopback: N virtual users
 * sign in, then loop over a realistic mix (list, open, compute, save draft,
 * export) for a fixed time. Prints p50/p95 per request kind and the errors.
 *
 *   npm run test:load -- [--users 50] [--seconds 60] [--base http://localhost:3100]
 *
 * Only loopback targets are allowed; the run stops by itself.
 */
import { performance } from "node:perf_hooks";

export interface LoadOptions {
  base: string;
  users: number;
  seconds: number;
  password?: string;
  /** Called once per second with the elapsed seconds (used by fault tests). */
  onTick?: (elapsed: number) => Promise<void> | void;
}

export interface LoadReport {
  requests: number;
  errors: { kind: string; status: number; body: string }[];
  byStatus: Record<number, number>;
  latency: Record<string, { n: number; p50: number; p95: number }>;
}

const ACCOUNTS = ["formulator@larkspur.example", "reviewer@larkspur.example", "admin@larkspur.example"];
/** ms between sign-in attempts that met a database outage (the sign-in limit allows 5 per 10 s per address). */
const SIGN_IN_RETRY_MS = 2500;

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return 0;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}

function assertLoopback(base: string) {
  const host = new URL(base).hostname;
  if (!["localhost", "127.0.0.1", "[::1]", "::1"].includes(host) && !host.startsWith("127.")) {
    throw new Error(`Refusing to load ${host}: load runs target loopback only.`);
  }
}

export async function runLoad(opts: LoadOptions): Promise<LoadReport> {
  assertLoopback(opts.base);
  const password = opts.password ?? "larkspur-demo-2026";
  const samples: Record<string, number[]> = {};
  const report: LoadReport = { requests: 0, errors: [], byStatus: {}, latency: {} };
  const deadline = Date.now() + opts.seconds * 1000;
  const block = Math.floor(Math.random() * 200);

  async function call(kind: string, ip: string, cookie: string, path: string, init: RequestInit = {}, expectStatus: number[] = [200]) {
    const t0 = performance.now();
    let status = 0;
    let body = "";
    try {
      const res = await fetch(`${opts.base}${path}`, {
        ...init,
        headers: { "content-type": "application/json", origin: opts.base, "x-forwarded-for": ip, cookie, ...(init.headers as object) },
        redirect: "manual",
      });
      status = res.status;
      body = await res.text();
      (samples[kind] ??= []).push(performance.now() - t0);
      report.requests++;
      report.byStatus[status] = (report.byStatus[status] ?? 0) + 1;
      if (!expectStatus.includes(status)) report.errors.push({ kind, status, body: body.slice(0, 300) });
      return { status, body, res };
    } catch (err) {
      report.requests++;
      report.errors.push({ kind, status: 0, body: err instanceof Error ? err.message : String(err) });
      return { status: 0, body: "", res: null };
    }
  }

  async function user(i: number) {
    const ip = `10.${block}.${Math.floor(i / 250)}.${(i % 250) + 1}`;
    const email = ACCOUNTS[i % ACCOUNTS.length]!;
    const signInBody = JSON.stringify({ email, password });
    let signIn = await call("sign-in", ip, "", "/api/auth/sign-in/email", { method: "POST", body: signInBody });
    // A sign-in that meets a database outage (503) is tried again a little later, as a person would:
    // every 2.5 s, so the retries stay within the sign-in limit (5 per 10 s per address) and never meet a 429.
    while (signIn.status === 503 && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, SIGN_IN_RETRY_MS));
      signIn = await call("sign-in", ip, "", "/api/auth/sign-in/email", { method: "POST", body: signInBody });
    }
    if (!signIn.res || signIn.status !== 200) return;
    const cookie = signIn.res.headers
      .getSetCookie()
      .map((c) => c.split(";")[0])
      .join("; ");
    const list = await call("list", ip, cookie, "/api/formulations?pageSize=25");
    const rows = list.status === 200 ? (JSON.parse(list.body) as { rows: { id: string }[] }).rows : [];
    const materials = await call("materials", ip, cookie, "/api/materials?pageSize=500");
    const lib = materials.status === 200 ? (JSON.parse(materials.body) as { rows: { id: string; referenceId: string | null }[] }).rows : [];
    // A draft of this user's own to save repeatedly (formulators only).
    let draft: { id: string; version: number; input: unknown } | null = null;
    const first = rows[0] ? await call("open", ip, cookie, `/api/formulations/${rows[0].id}`) : null;
    const revisionIds = first?.status === 200 ? (JSON.parse(first.body) as { revisions: { id: string }[] }).revisions.map((r) => r.id) : [];
    const anyRevision = revisionIds[0] ? await call("open", ip, cookie, `/api/revisions/${revisionIds[0]}`) : null;
    const input = anyRevision?.status === 200 ? (JSON.parse(anyRevision.body) as { input: unknown }).input : null;
    if (email.startsWith("formulator") && input) {
      const created = await call(
        "create",
        ip,
        cookie,
        "/api/formulations",
        { method: "POST", body: JSON.stringify({ name: `Load ${block}-${i}-${Date.now()}`, project: "Load run", input }) },
        [201],
      );
      if (created.status === 201) draft = { id: (JSON.parse(created.body) as { revisionId: string }).revisionId, version: 1, input };
    }
    void lib;
    let n = 0;
    while (Date.now() < deadline) {
      n++;
      const r = rows[n % Math.max(rows.length, 1)];
      await call("list", ip, cookie, `/api/formulations?pageSize=25&page=${(n % 3) + 1}`);
      if (r) await call("open", ip, cookie, `/api/formulations/${r.id}`);
      if (input) await call("compute", ip, cookie, "/api/compute", { method: "POST", body: JSON.stringify(input) });
      if (draft) {
        const saved = await call("save", ip, cookie, `/api/revisions/${draft.id}`, {
          method: "PUT",
          body: JSON.stringify({ version: draft.version, input: draft.input }),
        });
        if (saved.status === 200) draft.version = (JSON.parse(saved.body) as { version: number }).version;
      }
      if (revisionIds[0]) await call("export", ip, cookie, `/api/revisions/${revisionIds[0]}`);
    }
  }

  let ticker: NodeJS.Timeout | undefined;
  if (opts.onTick) {
    const start = Date.now();
    let busy = false;
    ticker = setInterval(() => {
      if (busy) return;
      busy = true;
      Promise.resolve(opts.onTick!(Math.round((Date.now() - start) / 1000))).finally(() => (busy = false));
    }, 1000);
  }
  await Promise.all(Array.from({ length: opts.users }, (_, i) => user(i)));
  if (ticker) clearInterval(ticker);
  for (const [kind, xs] of Object.entries(samples)) {
    const sorted = xs.sort((a, b) => a - b);
    report.latency[kind] = { n: sorted.length, p50: percentile(sorted, 50), p95: percentile(sorted, 95) };
  }
  return report;
}

export function printReport(r: LoadReport, title: string): void {
  console.log(`\n${title}: ${r.requests} requests, ${r.errors.length} errors, statuses ${JSON.stringify(r.byStatus)}`);
  console.log("kind        n      p50 ms   p95 ms");
  for (const [kind, l] of Object.entries(r.latency)) {
    console.log(`${kind.padEnd(10)} ${String(l.n).padStart(6)} ${l.p50.toFixed(1).padStart(8)} ${l.p95.toFixed(1).padStart(8)}`);
  }
  for (const e of r.errors.slice(0, 5)) console.log(`  error ${e.kind} ${e.status}: ${e.body}`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const arg = (name: string, def: string) => {
    const i = process.argv.indexOf(`--${name}`);
    return i > 0 ? process.argv[i + 1]! : def;
  };
  const base = arg("base", `http://localhost:${process.env.PORT ?? 3000}`);
  runLoad({ base, users: Number(arg("users", "50")), seconds: Number(arg("seconds", "60")) })
    .then((r) => {
      printReport(r, `Load: ${arg("users", "50")} virtual users for ${arg("seconds", "60")} s against ${base}`);
      process.exit(r.errors.length === 0 ? 0 : 1);
    })
    .catch((err: unknown) => {
      console.error(err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
