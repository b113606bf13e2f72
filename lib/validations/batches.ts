/** zod schemas of the batch record routes; what people type into a record goes through the one text rule. */
import { z } from "zod";
import { BATCH_STATES } from "@/lib/enums";
import { lineTextField, notesField } from "./text";

const id = z.string().trim().min(1, "Required").max(36, "At most 36 characters");
const balanceResolutionGrams = z.number().positive("The balance resolution must be greater than 0 g").max(10, "At most 10 g");

export const startBatchSchema = z.strictObject({
  revisionId: id,
  notes: notesField(5000).optional(),
  balanceResolutionGrams: balanceResolutionGrams.optional(),
});

export const batchListQuerySchema = z.object({
  formulationId: z.string().max(36).optional(),
  revisionId: z.string().max(36).optional(),
  state: z.enum(BATCH_STATES).optional(),
});

export const recordLineSchema = z.strictObject({
  actualGrams: z.number({ error: "The actual mass must be a number in g" }).min(0, "The actual mass must not be negative").max(1e7).nullable().optional(),
  lotNumber: lineTextField(100, "Lot number"),
  initials: lineTextField(10, "Initials"),
});

export const batchNotesSchema = z.strictObject({ notes: notesField(5000) });

export const batchSettingsSchema = z.strictObject({
  toleranceFraction: z.number().positive("The tolerance must be greater than 0").max(0.5, "At most 0.5 (±50 %)"),
  balanceResolutionGrams,
});
