import { availableParallelism } from "node:os";
import { afterEach, describe, expect, it } from "vitest";
import { ApiError, errorResponse } from "@/lib/http/errors";
import { computeFromText, type EngineReply } from "@/lib/compute/from-text";
import { computeWorkerCount, EnginePool, unwrap } from "@/lib/compute/pool";
import { computeFormulation } from "@/lib/formulation";
import { FormulationError } from "@/lib/formulation/errors";
import type { FormulationInput } from "@/lib/formulation/input-schema";
import { ref } from "@/lib/formulation/test-support";
import { parseSettings } from "@/lib/settings";
import { startTypeScriptWorker, typeScriptWorkerOptions } from "@/lib/worker-threads";

// The pool's behaviour is our own design (lib/compute/pool.ts); the results it carries are
// checked against the engine itself, in this process.

/** 10 g of silica from TEOS in ethanol, R = 4, HCl 37 %: the engine's own documented example. */
const teosSilicaInput = (): FormulationInput => ({
  materials: [ref("teos"), ref("ethanol"), ref("water-di"), ref("hcl-37")],
  basis: { type: "solidMass", grams: 10 },
  components: [{ materialId: "teos", weightFraction: 1 }],
  water: { materialId: "water-di", ratio: "R", value: 4 },
  solvent: { materialId: "ethanol", mode: "molPerNetworkAtom", value: 4 },
  catalyst: { materialId: "hcl-37", molPerNetworkAtom: 0.01 },
  steps: [{ name: "dry", temperatureC: 60, durationH: 24 }],
});

describe("computeFromText", () => {
  it("gives the engine's result as JSON", () => {
    const input = teosSilicaInput();
    const reply = computeFromText(JSON.stringify(input));
    expect(reply.ok).toBe(true);
    expect(JSON.parse((reply as { json: string }).json)).toEqual(JSON.parse(JSON.stringify(computeFormulation(input))));
  });

  it("tells a body that is not JSON from an input the engine refuses", () => {
    expect(computeFromText("{not json")).toEqual({ ok: false, kind: "malformed_json" });
    const refused = computeFromText("[]") as Extract<EngineReply, { kind: "formulation" }>;
    expect([refused.kind, refused.code, refused.field]).toEqual(["formulation", "invalid_input", ""]);
    expect((computeFromText("") as { kind: string }).kind).toBe("formulation");
  });
});

describe("unwrap", () => {
  it("turns each reply back into the answer or error the route gives", async () => {
    expect(unwrap({ ok: true, json: "{}" })).toBe("{}");
    expect(() => unwrap({ ok: false, kind: "malformed_json" })).toThrow(ApiError);
    const issues = [{ field: "components", message: "fractions sum to 0.9, not 1" }];
    let thrown: unknown;
    try {
      unwrap({ ok: false, kind: "formulation", code: "fractions_do_not_sum", field: "components", message: "sum", issues });
    } catch (err) {
      thrown = err;
    }
    expect(thrown).toBeInstanceOf(FormulationError);
    expect((thrown as FormulationError).issues).toEqual(issues);
    const res = errorResponse(thrown);
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { fields: object } }).error.fields).toEqual({ components: "fractions sum to 0.9, not 1" });
    expect(() => unwrap({ ok: false, kind: "internal", message: "boom" })).toThrow(/boom/);
  });

  it("names the body for an issue with the input as a whole", async () => {
    const res = errorResponse(new FormulationError("invalid_input", "", "formulation input must be an object"));
    expect(((await res.json()) as { error: { fields: object } }).error.fields).toEqual({ body: "formulation input must be an object" });
  });
});

const pools: EnginePool[] = [];
/** A pool of stand-in workers (tests/helpers/fake-engine-worker.ts). */
function fakePool(size: number, timeoutMs = 5_000): EnginePool {
  const spawn = () => startTypeScriptWorker(import.meta.url, "../helpers/fake-engine-worker.ts");
  const pool = new EnginePool({ size, timeoutMs, spawn });
  pools.push(pool);
  return pool;
}
const answer = async (p: Promise<EngineReply>) => JSON.parse(unwrap(await p)) as { text: string; threadId: number };

afterEach(() => {
  for (const pool of pools.splice(0)) pool.close();
});

describe("EnginePool", () => {
  it("gives each caller its own answer when answers come back out of order", async () => {
    const pool = fakePool(1);
    const [slow, fast] = await Promise.all([answer(pool.run("wait:60")), answer(pool.run("wait:1"))]);
    expect([slow.text, fast.text]).toEqual(["wait:60", "wait:1"]);
    expect(pool.started).toBe(1);
  });

  it("starts another worker while all are busy, up to its size", async () => {
    const pool = fakePool(2);
    const results = await Promise.all(["wait:40", "wait:40", "wait:40"].map((t) => answer(pool.run(t))));
    expect(pool.started).toBe(2);
    expect(new Set(results.map((r) => r.threadId)).size).toBe(2);
  });

  it("answers 503 when its worker dies, and starts a new one for the next calculation", async () => {
    const pool = fakePool(1);
    const lost = pool.run("exit");
    await expect(lost).rejects.toMatchObject({ status: 503, code: "calculator_restarted" });
    expect((await answer(pool.run("wait:0"))).text).toBe("wait:0");
    expect(pool.started).toBe(2);
  });

  it("stops a calculation that overruns its time, with 503, and carries on with a new worker", async () => {
    const pool = fakePool(1, 3_000); // room for a slow worker start (from source, through tsx) on a busy machine
    const hung = pool.run("hang");
    const behind = pool.run("wait:10000"); // on the same worker: lost with it
    await expect(hung).rejects.toMatchObject({ status: 503, code: "compute_timeout" });
    await expect(behind).rejects.toMatchObject({ status: 503, code: "calculator_restarted" });
    expect((await answer(pool.run("wait:0"))).text).toBe("wait:0");
    expect(pool.started).toBe(2);
    expect(pool.size).toBe(1);
  });
});

describe("the engine worker (lib/compute/worker.ts)", () => {
  it("runs from its TypeScript source and answers as the engine does in this thread", async () => {
    const spawn = () => startTypeScriptWorker(import.meta.url, "../../lib/compute/worker.ts");
    const pool = new EnginePool({ size: 1, timeoutMs: 20_000, spawn });
    pools.push(pool);
    const input = JSON.stringify(teosSilicaInput());
    expect(JSON.parse(unwrap(await pool.run(input)))).toEqual(JSON.parse(unwrap(computeFromText(input))));
    await expect(pool.run("{not json")).resolves.toEqual({ ok: false, kind: "malformed_json" });
  });
});

describe("typeScriptWorkerOptions", () => {
  it("keeps the memory limits and adds tsx's require hook", () => {
    expect(typeScriptWorkerOptions({ resourceLimits: { maxOldGenerationSizeMb: 1 } })).toEqual({
      resourceLimits: { maxOldGenerationSizeMb: 1 },
      execArgv: ["--require", "tsx/cjs"],
    });
  });
});

describe("computeWorkerCount", () => {
  const saved = process.env.GELWRIGHT_COMPUTE_WORKERS;
  afterEach(() => {
    if (saved === undefined) delete process.env.GELWRIGHT_COMPUTE_WORKERS;
    else process.env.GELWRIGHT_COMPUTE_WORKERS = saved;
  });

  it("takes 0 to 8 from the setting, 1 by default (0 on a one-core machine), and refuses anything else", () => {
    delete process.env.GELWRIGHT_COMPUTE_WORKERS;
    const fallback = computeWorkerCount();
    expect(fallback).toBe(availableParallelism() > 1 ? 1 : 0);
    expect(parseSettings({}, { cpus: 1 }).workers.compute).toBe(0);
    expect(parseSettings({}, { cpus: 4 }).workers.compute).toBe(1);
    for (const [setting, want] of [["0", 0], ["3", 3], ["8", 8], ["", fallback]] as const) {
      process.env.GELWRIGHT_COMPUTE_WORKERS = setting;
      expect(computeWorkerCount(), setting).toBe(want);
    }
    for (const setting of ["9", "-1", "two", "1.5"]) {
      process.env.GELWRIGHT_COMPUTE_WORKERS = setting;
      expect(() => computeWorkerCount(), setting).toThrow(`GELWRIGHT_COMPUTE_WORKERS=“${setting}”: expected a whole number from 0 to 8`);
    }
  });
});
