import { computeJson } from "@/lib/compute/pool";
import { readText } from "@/lib/http/body";
import { route } from "@/lib/http/route";

/**
 * Computes a recipe from a FormulationInput without saving anything. The
 * body is parsed, validated (422 naming each field) and computed in an
 * engine worker thread (lib/compute/pool.ts), which also writes the JSON.
 * The calculator reads no stored data, so a session checked in the last 30 s
 * is trusted (`brief`).
 */
export const POST = route({ permission: "material:read", brief: true }, async (req) => {
  const json = await computeJson(await readText(req));
  return new Response(json, { headers: { "content-type": "application/json" } });
});
