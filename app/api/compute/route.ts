import { readText, route } from "@/lib/api";
import { computeJson } from "@/lib/compute/pool";
import { requireContextBriefly } from "@/lib/session";

/**
 * Computes a recipe from a FormulationInput without saving anything. The
 * body is parsed, validated (422 naming each field) and computed in an
 * engine worker thread (lib/compute/pool.ts), which also writes the JSON.
 */
export const POST = route(async (req) => {
  // The calculator reads no stored data, so a session checked in the last 30 s is trusted.
  await requireContextBriefly(req.headers, "material:read");
  const json = await computeJson(await readText(req));
  return new Response(json, { headers: { "content-type": "application/json" } });
});
