/**
 * The one rule for user-entered names and notes on every route: visible,
 * no bidirectional or control characters, no broken UTF-16, a length limit.
 * It is defined beside the engine (lib/formulation/text-rules.ts) because the
 * engine's material and process-step schemas apply it too; routes use these.
 */
import { z } from "zod";
import { multilineText, nameText, textProblem } from "@/lib/formulation";

/** A required name, trimmed, at most `max` characters (422 naming the field when invisible, bidi, control …). */
export function nameField(max: number, label = "Name"): z.ZodType<string, string> {
  return nameText(label, { max, trim: true });
}

/** Notes of several lines, trimmed; null clears them. Add `.optional()` where they may be left out. */
export function notesField(max: number, label = "Notes") {
  return multilineText(label, { max }).nullable();
}

/** Optional text on one line (a project, lot number, initials), trimmed; empty clears it. */
export function lineTextField(max: number, label: string) {
  return z
    .string()
    .trim()
    .max(max, `At most ${max} characters`)
    .superRefine((value, ctx) => {
      const problem = value === "" ? null : textProblem(value);
      if (problem) ctx.addIssue({ code: "custom", message: `${label} ${problem}` });
    })
    .nullish();
}
