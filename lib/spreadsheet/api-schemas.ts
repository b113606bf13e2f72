/** zod schemas of the batch, import and attachment routes (shared with the pages that call them). */
import { z } from "zod";

const uuid = z.string().trim().min(1, "Required").max(36, "At most 36 characters");

export const startBatchSchema = z.strictObject({
  revisionId: uuid,
  notes: z.string().trim().max(5000, "At most 5000 characters").nullish(),
  balanceResolutionGrams: z.number().positive("The balance resolution must be greater than 0 g").max(10, "At most 10 g").optional(),
});

export const batchListQuerySchema = z.object({
  formulationId: z.string().max(36).optional(),
  revisionId: z.string().max(36).optional(),
  state: z.enum(["open", "closed"]).optional(),
});

export const recordLineSchema = z.strictObject({
  actualGrams: z.number({ error: "The actual mass must be a number in g" }).min(0, "The actual mass must not be negative").max(1e7).nullable().optional(),
  lotNumber: z.string().trim().max(100, "At most 100 characters").nullable().optional(),
  initials: z.string().trim().max(10, "At most 10 characters").nullable().optional(),
});

export const batchNotesSchema = z.strictObject({
  notes: z.string().trim().max(5000, "At most 5000 characters").nullable(),
});

export const batchSettingsSchema = z.strictObject({
  toleranceFraction: z.number().positive("The tolerance must be greater than 0").max(0.5, "At most 0.5 (±50 %)"),
  balanceResolutionGrams: z.number().positive("The balance resolution must be greater than 0 g").max(10, "At most 10 g"),
});

export const importKindSchema = z.enum(["formulation", "materials"], { error: 'kind must be "formulation" or "materials"' });

export const attachmentOwnerSchema = z.object({
  ownerType: z.enum(["material", "batch"], { error: 'ownerType must be "material" or "batch"' }),
  ownerId: uuid,
});

export const attachmentKindSchema = z.enum(["sds", "coa", "other"], { error: 'kind must be "sds" (safety data sheet), "coa" (certificate of analysis) or "other"' });
