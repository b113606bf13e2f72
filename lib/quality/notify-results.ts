import "server-only";
import { emailsByRole } from "@/db/queries/members";
import type { EnteredResult } from "@/db/queries/results";
import { sendMail } from "@/lib/mail";
import { settings } from "@/lib/settings";

/** Tells the team's reviewers about an out-of-specification result. Mail failures never undo the result. */
export async function notifyOutOfSpec(teamId: string, r: EnteredResult): Promise<void> {
  if (!r.outOfSpec) return;
  const to = await emailsByRole(teamId, ["reviewer"]);
  if (to.length === 0) return;
  const { spec } = r;
  const limits = `${spec.lower ?? "–"} to ${spec.upper ?? "–"} ${spec.unit}`.trim();
  const title = `${r.formulationName}, revision ${r.revisionNumber}`;
  await sendMail({
    kind: "team",
    teamId,
    to,
    subject: `Out of specification: ${spec.property} on a batch of ${title}`,
    text: `${spec.property}: ${r.value} ${spec.unit} is outside the specification (${limits}).\nThe result must be acknowledged before the batch can be released.\n\n${settings().server.baseUrl}/batches/${r.batchId}\n`,
  });
}
