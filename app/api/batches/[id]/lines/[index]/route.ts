import { recordLine } from "@/db/queries/batches";
import { ApiError, readJson, route } from "@/lib/api";
import { recordLineBodySchema } from "@/lib/validations/api";
import { requireContext } from "@/lib/session";

/** PATCH /api/batches/:id/lines/:index { actualGrams?, lotNumber?, initials? } : one line, 0-based index. */
export const PATCH = route<{ id: string; index: string }>(async (req, { params }) => {
  const ctx = await requireContext(req.headers, "batch:update");
  const { id, index } = await params;
  const n = Number(index);
  if (!Number.isInteger(n) || n < 0 || n > 10_000) throw new ApiError(404, "not_found", "No such line.");
  const body = await readJson(req, recordLineBodySchema);
  return Response.json(await recordLine(ctx, id, n, body));
});
