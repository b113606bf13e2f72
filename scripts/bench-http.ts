/**
 * HTTP benchmarks against a production build on loopback (started by scripts/bench.sh):
 * /api/compute vs /api/health throughput and p95, the formulation list with
 * 10,000 formulations, and first-load JavaScript per page measured in Chromium.
 * Every figure is the median of several runs; comparisons are ratios from the same run.
 */
import autocannon from "autocannon";
import { chromium } from "playwright-core";

const BASE = process.env.BENCH_BASE ?? "http://localhost:3120";
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${BASE}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE, "x-forwarded-for": `10.250.0.${Math.floor(Math.random() * 250)}` },
    body: JSON.stringify({ email, password: "larkspur-demo-2026" }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

async function cannon(opts: autocannon.Options): Promise<{ rps: number; p95: number; errors: number; non2xx: number }> {
  const r = await autocannon({ connections: 10, duration: SECONDS, ...opts });
  return { rps: r.requests.average, p95: r.latency.p97_5 ?? r.latency.p99, errors: r.errors, non2xx: r.non2xx };
}

async function firstLoadJs(cookie: string, paths: string[]): Promise<{ path: string; kb: number }[]> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
  });
  const out: { path: string; kb: number }[] = [];
  try {
    const context = await browser.newContext();
    const [name, value] = cookie.split("; ").find((c) => c.startsWith("gelwright.session_token"))!.split("=");
    await context.addCookies([{ name: name!, value: value!, url: BASE }]);
    for (const path of paths) {
      const page = await context.newPage();
      await page.goto(`${BASE}${path}`, { waitUntil: "networkidle" });
      const bytes = await page.evaluate(() =>
        performance
          .getEntriesByType("resource")
          .filter((e) => (e as PerformanceResourceTiming).initiatorType === "script" || e.name.endsWith(".js"))
          .reduce((sum, e) => sum + ((e as PerformanceResourceTiming).encodedBodySize || 0), 0),
      );
      out.push({ path, kb: bytes / 1024 });
      await page.close();
    }
  } finally {
    await browser.close();
  }
  return out;
}

async function main() {
  const cookie = await signIn("formulator@larkspur.example");
  const list = (await (await fetch(`${BASE}/api/formulations?pageSize=5&sort=name`, { headers: { cookie } })).json()) as {
    total: number;
    rows: { id: string }[];
  };
  const f = (await (await fetch(`${BASE}/api/formulations/${list.rows[0]!.id}`, { headers: { cookie } })).json()) as { revisions: { id: string }[] };
  const rev = (await (await fetch(`${BASE}/api/revisions/${f.revisions[0]!.id}`, { headers: { cookie } })).json()) as { input: unknown };
  const body = JSON.stringify(rev.input);

  const ratios: number[] = [];
  const health: number[] = [];
  const compute: number[] = [];
  const computeP95: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const h = await cannon({ url: `${BASE}/api/health` });
    const c = await cannon({
      url: `${BASE}/api/compute`,
      method: "POST",
      headers: { cookie, "content-type": "application/json", origin: BASE },
      body,
    });
    if (c.non2xx || c.errors) console.log(`  compute run ${i}: ${c.non2xx} non-2xx, ${c.errors} errors`);
    health.push(h.rps);
    compute.push(c.rps);
    computeP95.push(c.p95);
    ratios.push(c.rps / h.rps);
  }

  const listP95: number[] = [];
  const listP95Single: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const page = 1 + Math.floor(Math.random() * 100);
    const url = `${BASE}/api/formulations?pageSize=25&sort=updatedAt&page=${page}&state=draft`;
    listP95.push((await cannon({ url, headers: { cookie }, connections: 4 })).p95);
    listP95Single.push((await cannon({ url, headers: { cookie }, connections: 1 })).p95);
  }

  const pages = ["/sign-in", "/", "/formulations", "/materials"];
  const js = await firstLoadJs(cookie, pages);

  const rows: [string, string, string][] = [
    ["/api/health throughput", `${median(health).toFixed(0)} req/s`, ""],
    ["/api/compute throughput", `${median(compute).toFixed(0)} req/s`, ""],
    ["compute ÷ health (same run)", `${median(ratios).toFixed(2)}×`, "target ≥ 0.70×"],
    ["/api/compute p97.5 latency", `${median(computeP95).toFixed(1)} ms`, ""],
    [`list API p97.5, ${list.total} formulations, 1 client`, `${median(listP95Single).toFixed(1)} ms`, "target ≤ 50 ms"],
    [`list API p97.5, ${list.total} formulations, 4 clients`, `${median(listP95).toFixed(1)} ms`, ""],
    ...js.map((j): [string, string, string] => [`first-load JS ${j.path}`, `${j.kb.toFixed(0)} kB (compressed)`, "target ≤ 180 kB"]),
  ];
  const engineThreads = process.env.GELWRIGHT_COMPUTE_WORKERS ?? "1";
  console.log(`\nHTTP benchmarks (${RUNS} runs × ${SECONDS} s, 10 connections; medians; engine threads: ${engineThreads})`);
  for (const [k, v, t] of rows) console.log(`${k.padEnd(44)} ${v.padStart(22)}   ${t}`);
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.stack : err);
  process.exit(1);
});
