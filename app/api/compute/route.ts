import { z } from "zod";
import { computeFormulation } from "@/lib/formulation";
import { readJson, route } from "@/lib/api";
import { requireContext } from "@/lib/session";

const anyJson = z.unknown();

/**
 * Computes a recipe from a FormulationInput without saving anything. The
 * engine validates its input itself (422 naming each field), so the body is
 * parsed once, not twice.
 */
export const POST = route(async (req) => {
  await requireContext(req.headers, "material:read");
  const input = await readJson(req, anyJson);
  return Response.json(computeFormulation(input as Parameters<typeof computeFormulation>[0]));
});
