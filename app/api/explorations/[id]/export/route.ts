import { getExplorationWithInput } from "@/db/queries/explorations";
import { NotFoundError } from "@/lib/errors";
import { readQuery } from "@/lib/http/body";
import { fileResponse } from "@/lib/http/files";
import { route } from "@/lib/http/route";
import { exportExploration } from "@/lib/spreadsheet/exploration-export";
import { downloadQuerySchema } from "@/lib/validations/query";

/**
 * GET /api/explorations/:id/export?format=xlsx|csv : the saved exploration's
 * points, computed again on the revision's stored input with the numeric path
 * (one row per point, headings with units, an About block), in a worker
 * thread of its own (lib/spreadsheet/exploration-export.ts). A grid that no
 * longer fits the revision (a draft changed since) is a 422 naming the grid's
 * field; another format is a 422 naming `format`; 503 while other exports
 * are being prepared.
 */
export const GET = route<{ id: string }>({ permission: "formulation:readUnreleased" }, async (req, { team, params }) => {
  const { format = "xlsx" } = readQuery(req, downloadQuerySchema);
  const e = await getExplorationWithInput(team.id, params.id);
  if (!e) throw new NotFoundError("exploration");
  const bytes = await exportExploration({
    format,
    formulationName: e.formulationName,
    revisionLabel: `Revision ${e.revisionNumber}`,
    explorationName: e.name,
    base: e.input,
    grid: e.grid,
    outputs: e.outputs,
    ...(e.search ? { search: e.search } : {}),
  });
  return fileResponse(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength), `${e.formulationName} r${e.revisionNumber} ${e.name}`, format);
});
