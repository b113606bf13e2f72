/**
 * Request bodies of the specification and test-result routes (zod). Field
 * paths in the messages name the field: `specifications.2.upper`, `value`.
 */
import { z } from "zod";
import { specificationsSchema } from "./specification";

/** PUT /api/revisions/:id/specifications */
export const replaceSpecificationsSchema = z.strictObject({
  specifications: specificationsSchema.superRefine((list, ctx) => {
    const seen = new Set<string>();
    list.forEach((s, i) => {
      if (seen.has(s.id)) ctx.addIssue({ code: "custom", path: [i, "id"], message: "this specification id appears twice" });
      seen.add(s.id);
    });
  }),
  version: z.number({ error: "version must be a number" }).int().min(1),
});

/** Longest instrument name and text result (characters), as stored. */
export const RESULT_TEXT_MAX = { instrument: 200, value: 500, acknowledgement: 2000 } as const;

/**
 * POST /api/batches/:id/results. `value` is a number for a numeric
 * specification and a text for a non-numeric one; which applies is checked
 * against the specification (results.ts), a text in a numeric field is a 422
 * naming `value`.
 */
export const enterResultSchema = z.strictObject({
  specId: z.string({ error: "specId must be a specification id" }).uuid({ error: "specId must be a specification id" }),
  value: z.union([z.number().finite(), z.string().trim().min(1).max(RESULT_TEXT_MAX.value)], {
    error: "value must be a number or a text of at most 500 characters",
  }),
  instrument: z.string().trim().max(RESULT_TEXT_MAX.instrument, { error: "instrument must be at most 200 characters" }).nullish(),
});

/** POST /api/batches/:id/results/:resultId/acknowledge */
export const acknowledgeResultSchema = z.strictObject({
  note: z
    .string({ error: "note must be a text" })
    .trim()
    .min(3, { error: "write why the out-of-specification result is acceptable (at least 3 characters)" })
    .max(RESULT_TEXT_MAX.acknowledgement, { error: "note must be at most 2000 characters" }),
});
