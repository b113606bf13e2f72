/** zod schemas of the exploration routes and of opening a candidate as a new draft. */
import { z } from "zod";
import { EXPLORATION_NAME_MAX, EXPLORE_MAX_POINTS, explorationBodySchema } from "@/lib/explore/spec";
import { formulationInputSchema } from "@/lib/formulation";
import { nameField } from "./text";

/**
 * The most a saved exploration's body may hold, bytes. A full one (20
 * figures, 10 candidates with 40 figures each) is about 30 kB; the limit
 * leaves room and refuses anything far past it while it streams in.
 */
export const EXPLORATION_BODY_MAX_BYTES = 256 * 1024;

/**
 * POST /api/formulations/:id/explorations: the contract's body
 * (lib/explore/spec.ts), its name held to the one text rule, no unknown keys.
 */
export const saveExplorationSchema = z.strictObject({
  ...explorationBodySchema.shape,
  name: nameField(EXPLORATION_NAME_MAX),
});

/** ?revision=<id> narrows a formulation's list to one revision's explorations. */
export const explorationListQuerySchema = z.object({
  revision: z.string().trim().min(1, "revision must be a revision id").max(64, "revision must be a revision id").optional(),
});

/**
 * POST /api/formulations/:id/revisions: no body (or `{}`) starts the new draft
 * from the newest revision; `{ input }` starts it with that input (a candidate
 * of an exploration, with `fromExploration` saying which point it was).
 */
export const startRevisionSchema = z
  .strictObject({
    input: formulationInputSchema.optional(),
    fromExploration: z
      .strictObject({
        explorationId: z.string().trim().min(1, "explorationId must be an exploration id").max(64, "explorationId must be an exploration id").optional(),
        point: z.number({ error: "point must be a whole number" }).int("point must be a whole number").min(0, "point must be 0 or more").max(EXPLORE_MAX_POINTS - 1, `point must be below ${EXPLORE_MAX_POINTS}`),
      })
      .optional(),
  })
  .refine((b) => !b.fromExploration || b.input, { error: "give the candidate's input with fromExploration", path: ["input"] });
export type StartRevisionBody = z.infer<typeof startRevisionSchema>;
