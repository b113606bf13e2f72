/**
 * Test specifications of a revision: what production measures on each batch
 * and the limits a result must meet. Part of what the reviewer approves:
 * stored with the revision (`revisions.specifications`), immutable once the
 * revision leaves draft, copied into a new revision.
 */
import { z } from "zod";

/** Where a specification came from: proposed from the engine's figures, or entered by the formulator. */
export const SPEC_ORIGINS = ["computed", "entered"] as const;
export type SpecOrigin = (typeof SPEC_ORIGINS)[number];

/** Longest property, method and unit texts (characters). */
export const SPEC_TEXT_MAX = { property: 120, method: 300, unit: 30 } as const;

/**
 * One specification. A numeric property has a unit and at least one of
 * target, lower and upper limits (lower ≤ target ≤ upper when given); a
 * non-numeric one (appearance, cross-hatch class as text) has `numeric: false`
 * and its requirement in `method` or `target text`.
 */
export const specificationSchema = z
  .object({
    id: z.string().uuid({ error: "specification id must be a UUID" }),
    property: z.string().trim().min(1, { error: "property must not be empty" }).max(SPEC_TEXT_MAX.property),
    method: z.string().trim().max(SPEC_TEXT_MAX.method),
    unit: z.string().trim().max(SPEC_TEXT_MAX.unit),
    numeric: z.boolean({ error: "numeric must be true or false" }),
    target: z.number({ error: "target must be a number" }).finite().nullable(),
    lower: z.number({ error: "lower limit must be a number" }).finite().nullable(),
    upper: z.number({ error: "upper limit must be a number" }).finite().nullable(),
    /** Requirement of a non-numeric property, e.g. "clear, no haze" or "class 0 (ISO 2409)". */
    requirement: z.string().trim().max(SPEC_TEXT_MAX.method).nullable(),
    origin: z.enum(SPEC_ORIGINS),
  })
  .superRefine((spec, ctx) => {
    if (spec.numeric && spec.lower !== null && spec.upper !== null && spec.lower > spec.upper) {
      ctx.addIssue({ code: "custom", path: ["upper"], message: "upper limit must not be below the lower limit" });
    }
    if (spec.numeric && spec.target !== null && spec.lower !== null && spec.target < spec.lower) {
      ctx.addIssue({ code: "custom", path: ["target"], message: "target must not be below the lower limit" });
    }
    if (spec.numeric && spec.target !== null && spec.upper !== null && spec.target > spec.upper) {
      ctx.addIssue({ code: "custom", path: ["target"], message: "target must not be above the upper limit" });
    }
    if (spec.numeric && spec.lower === null && spec.upper === null) {
      ctx.addIssue({ code: "custom", path: ["lower"], message: "a numeric specification needs a lower or an upper limit" });
    }
  });

export type Specification = z.infer<typeof specificationSchema>;

/** At most this many specifications per revision. */
export const MAX_SPECIFICATIONS = 50;

export const specificationsSchema = z
  .array(specificationSchema, { error: "specifications must be a list" })
  .max(MAX_SPECIFICATIONS, { error: `at most ${MAX_SPECIFICATIONS} specifications per revision` });
