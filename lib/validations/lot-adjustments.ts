/**
 * zod schemas of a lot's stock adjustment (POST /api/lots/:id/adjustments) and
 * of the "Adjust stock" form on the lot page: the same rules and messages.
 */
import { z } from "zod";
import { LOT_ADJUSTMENT_REASONS } from "@/lib/enums";
import { notesField } from "./text";

/** The largest quantity on hand a request may name, in the lot's unit (the same bound as receiving a lot). */
export const ADJUSTED_QUANTITY_MAX = 1e9;

/**
 * How far above the quantity received an adjustment may set the quantity on
 * hand (× the received amount): a recount finds more than was booked, never
 * ten times the delivery. Checked with the stored lot (422 naming quantityOnHand).
 */
export const ADJUSTED_QUANTITY_FACTOR = 10;

/** The longest note of an adjustment, in characters. */
export const ADJUSTMENT_NOTE_MAX = 2000;

const versionField = () =>
  z
    .number({ error: "The version must be a number (the lot's version as you read it)" })
    .int("The version must be a whole number")
    .min(1, "The version must be at least 1")
    .max(2_147_483_647, "The version is too large");

const quantityField = () =>
  z
    .number({ error: "The quantity on hand must be a number (what you counted, in the lot's unit)" })
    .min(0, "The quantity on hand must not be negative")
    .max(ADJUSTED_QUANTITY_MAX, "The quantity on hand is too large");

const reasonField = () =>
  z.enum(LOT_ADJUSTMENT_REASONS, { error: 'The reason must be one of "recount", "damaged", "disposed", "sample" or "other"' });

const noteField = () => notesField(ADJUSTMENT_NOTE_MAX, "The note");

const NOTE_REQUIRED = 'The note is required when the reason is "other": say what happened';

/** A note with visible text, or nothing. */
function hasNote(note: string | null | undefined): boolean {
  return typeof note === "string" && note.trim() !== "";
}

/**
 * A stock adjustment: the lot's `version` as read, the quantity now on hand
 * (what was counted, ≥ 0, in the lot's unit), the reason, and a note (required
 * for "other"). Unknown fields are refused.
 */
export const adjustLotSchema = z
  .strictObject({
    version: versionField(),
    quantityOnHand: quantityField(),
    reason: reasonField(),
    note: noteField().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.reason === "other" && !hasNote(v.note)) ctx.addIssue({ code: "custom", path: ["note"], message: NOTE_REQUIRED });
  });
export type AdjustLotInput = z.infer<typeof adjustLotSchema>;

/**
 * The "Adjust stock" form's fields as typed (text; a comma is taken as the
 * decimal point, an empty note is none), checked with the route's rules and messages.
 */
export const lotAdjustmentFormSchema = z
  .object({
    quantityOnHand: z
      .string()
      .transform((s) => (s.trim() === "" ? Number.NaN : Number(s.trim().replace(",", "."))))
      .pipe(quantityField()),
    reason: reasonField(),
    note: z
      .string()
      .transform((s) => (s.trim() === "" ? null : s.trim()))
      .pipe(noteField()),
  })
  .superRefine((v, ctx) => {
    if (v.reason === "other" && !hasNote(v.note)) ctx.addIssue({ code: "custom", path: ["note"], message: NOTE_REQUIRED });
  });
export type LotAdjustmentFormInput = z.input<typeof lotAdjustmentFormSchema>;
export type LotAdjustmentFormValues = z.output<typeof lotAdjustmentFormSchema>;
