import "server-only";
import { emailOfUser, emailsByRole } from "@/db/queries/members";
import type { TransitionOutcome } from "@/db/queries/revisions";
import { settings } from "./settings";
import { sendMail } from "./mail";

/** Tells the right people about a state change. Mail failures never undo the change. */
export async function notifyTransition(teamId: string, t: TransitionOutcome, comment?: string | null): Promise<void> {
  const link = `${settings().server.baseUrl}/formulations/${t.formulationId}`;
  const title = `${t.formulationName}, revision ${t.number}`;
  if (t.to === "in_review") {
    const to = await emailsByRole(teamId, ["reviewer"]);
    await sendMail({ kind: "team", teamId, to, subject: `Waiting for your review: ${title}`, text: `${title} was submitted for review.\n\n${link}\n` });
  } else if (t.from === "in_review" && (t.to === "approved" || t.to === "draft")) {
    const to = await emailOfUser(t.authorId);
    if (!to) return;
    const word = t.to === "approved" ? "approved" : "sent back to draft";
    await sendMail({
      kind: "team",
      teamId,
      to,
      subject: `${title} was ${word}`,
      text: `${title} was ${word}.${comment ? `\n\nReviewer's comment:\n${comment}` : ""}\n\n${link}\n`,
    });
  } else if (t.to === "released") {
    const to = await emailsByRole(teamId, ["production"]);
    await sendMail({
      kind: "team",
      teamId,
      to,
      subject: `Released to production: ${title}`,
      text: `${title} is released. Its batch sheet is ready.\n\n${link}\n`,
    });
  }
}
