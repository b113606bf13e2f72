import { z } from "zod";
import { computeFormulation } from "@/lib/formulation";
import { readJson, route } from "@/lib/api";
import { requireContextBriefly } from "@/lib/session";

const anyJson = z.unknown();

/**
 * Computes a recipe from a FormulationInput without saving anything. The
 * engine validates its input itself (422 naming each field), so the body is
 * parsed once, not twice.
 */
export const POST = route(async (req) => {
  // The calculator reads no stored data, so a session checked in the last 30 s is trusted.
  await requireContextBriefly(req.headers, "material:read");
  const input = await readJson(req, anyJson);
  return Response.json(computeFormulation(input as Parameters<typeof computeFormulation>[0]));
});
