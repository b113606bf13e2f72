import { computeFormulation, formulationInputSchema } from "@/lib/formulation";
import { readJson, route } from "@/lib/api";
import { requireContext } from "@/lib/session";

/** Computes a recipe from a FormulationInput without saving anything. */
export const POST = route(async (req) => {
  await requireContext(req.headers, "material:read");
  const input = await readJson(req, formulationInputSchema);
  return Response.json(computeFormulation(input));
});
