import "server-only";
import { emailsByRole } from "@/db/queries/members";
import { settings } from "./settings";
import { sendMail } from "./mail";

/** Tells the team's reviewers that a closed batch waits for its disposition. Mail failures never undo the close. */
export async function notifyAwaitingDisposition(teamId: string, batch: { id: string; formulationName: string; revisionNumber: number }): Promise<void> {
  const to = await emailsByRole(teamId, ["reviewer"]);
  const title = `${batch.formulationName}, revision ${batch.revisionNumber}, batch ${batch.id.slice(0, 8)}`;
  await sendMail({
    kind: "team",
    teamId,
    to,
    subject: `Waiting for release or rejection: ${title}`,
    text: `${title} is closed and waits for its disposition (release, rejection or release under deviation).\n\n${settings().server.baseUrl}/batches/${batch.id}\n`,
  });
}
