import { getBatchSettings, saveBatchSettings } from "@/db/queries/batches";
import { readJson, route } from "@/lib/api";
import { batchSettingsSchema } from "@/lib/spreadsheet/api-schemas";
import { requireContext } from "@/lib/session";

/** GET /api/batches/settings : { toleranceFraction, balanceResolutionGrams, isDefault }. */
export const GET = route(async (req) => {
  const ctx = await requireContext(req.headers, "batch:read");
  return Response.json(await getBatchSettings(ctx.teamId));
});

/** PUT /api/batches/settings { toleranceFraction, balanceResolutionGrams } : team admins only; applies to batches started afterwards. */
export const PUT = route(async (req) => {
  const ctx = await requireContext(req.headers, "organization:update");
  const body = await readJson(req, batchSettingsSchema);
  return Response.json(await saveBatchSettings(ctx, body));
});
