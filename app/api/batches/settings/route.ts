import { getBatchSettings, saveBatchSettings } from "@/db/queries/batches";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { batchSettingsSchema } from "@/lib/validations/batches";

/** GET /api/batches/settings : { toleranceFraction, balanceResolutionGrams, isDefault }. */
export const GET = route({ permission: "batch:read" }, async (_req, { team }) => {
  return Response.json(await getBatchSettings(team.id));
});

/** PUT /api/batches/settings { toleranceFraction, balanceResolutionGrams } : team admins only; applies to batches started afterwards. */
export const PUT = route({ permission: "organization:update" }, async (req, { actor }) => {
  return Response.json(await saveBatchSettings(actor, await readJson(req, batchSettingsSchema)));
});
