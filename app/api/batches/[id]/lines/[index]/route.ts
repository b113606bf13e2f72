import { recordLine } from "@/db/queries/batches";
import { NotFoundError } from "@/lib/errors";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { recordLineSchema } from "@/lib/validations/batches";

/** PATCH /api/batches/:id/lines/:index { actualGrams?, lotNumber?, initials? } : one line, 0-based index. */
export const PATCH = route<{ id: string; index: string }>({ permission: "batch:update" }, async (req, { actor, params }) => {
  const n = Number(params.index);
  if (!Number.isInteger(n) || n < 0 || n > 10_000) throw new NotFoundError("line");
  const body = await readJson(req, recordLineSchema);
  return Response.json(await recordLine(actor, params.id, n, body));
});
