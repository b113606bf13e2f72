/** Builds formulation inputs from a team's library, as the editor does. */
import type { Client } from "./http";

export interface LibraryMaterial {
  id: string;
  name: string;
  kind: string;
  referenceId: string | null;
  [key: string]: unknown;
}

export async function library(client: Client): Promise<Map<string, LibraryMaterial>> {
  const res = await client.fetch("/api/materials?pageSize=500");
  if (res.status !== 200) throw new Error(`materials: ${res.status}`);
  const body = (await res.json()) as { rows: LibraryMaterial[] };
  return new Map(body.rows.filter((m) => m.referenceId).map((m) => [m.referenceId!, m]));
}

/** A TEOS + GPTMS coat on polycarbonate; `cureC` sets the last step's temperature. */
export function coatInput(lib: Map<string, LibraryMaterial>, opts: { cureC?: number; teos?: number } = {}) {
  const m = (ref: string) => {
    const found = lib.get(ref);
    if (!found) throw new Error(`no ${ref} in the library`);
    const { referenceId: _r, updatedAt: _u, ...material } = found;
    void _r; void _u;
    return material;
  };
  const teos = opts.teos ?? 0.4;
  const materials = [m("teos"), m("gptms"), m("ethanol"), m("water-di"), m("hcl-37"), m("polycarbonate")];
  const id = (ref: string) => lib.get(ref)!.id;
  return {
    materials,
    basis: { type: "solidMass", grams: 20 },
    components: [
      { materialId: id("teos"), weightFraction: teos },
      { materialId: id("gptms"), weightFraction: Number((1 - teos).toFixed(6)) },
    ],
    water: { materialId: id("water-di"), ratio: "R", value: 2 },
    solvent: { materialId: id("ethanol"), mode: "molPerNetworkAtom", value: 4 },
    catalyst: { materialId: id("hcl-37"), molPerNetworkAtom: 0.01 },
    substrateId: id("polycarbonate"),
    steps: [
      { name: "Hydrolysis", temperatureC: 25, durationH: 2 },
      { name: "Cure", temperatureC: opts.cureC ?? 80, durationH: 2 },
    ],
    marginC: 20,
  };
}

/**
 * The body that saves an exploration (lib/explore/spec.ts): a component's
 * weight fraction swept 0.2 → 0.6 in steps of 0.1 (5 points), refractive
 * index and density shown, a search for the closest index to 1.5.
 */
export function explorationBody(revisionId: string, materialId: string, name = "Probe sweep") {
  return {
    revisionId,
    name,
    grid: { kind: "sweep", variables: [{ kind: "weightFraction", materialId, from: 0.2, to: 0.6, step: 0.1 }] },
    outputs: ["refractiveIndex", "theoreticalDensity"],
    search: { constraints: [{ output: "theoreticalDensity", min: 1 }], thermal: "caution", objective: { goal: "closest", output: "refractiveIndex", value: 1.5 } },
    pointCount: 5,
    candidates: [{ point: 1, values: [0.3], score: 0.01, figures: { refractiveIndex: 1.49, theoreticalDensity: 1.6 }, thermalStatus: "clear" }],
  };
}

/** Saves an exploration of a formulation through the API; returns its id. */
export async function saveExploration(client: Client, formulationId: string, body: ReturnType<typeof explorationBody>): Promise<string> {
  const res = await client.fetch(`/api/formulations/${formulationId}/explorations`, { method: "POST", json: body });
  if (res.status !== 201) throw new Error(`save exploration: ${res.status} ${await res.text()}`);
  return ((await res.json()) as { id: string }).id;
}
