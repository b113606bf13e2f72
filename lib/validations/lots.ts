/** zod schemas of the material lot, lot choice and disposition routes. */
import { z } from "zod";
import { BATCH_DISPOSITIONS, LOT_UNITS } from "@/lib/enums";
import { nameField, notesField } from "./text";

const id = (label: string) => z.string({ error: `${label} is required` }).trim().min(1, `${label} is required`).max(36, "At most 36 characters");
const isoDate = (label: string) =>
  z
    .string({ error: `${label} must be a date (YYYY-MM-DD)` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD)`)
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), `${label} is not a real date`);

const supplierField = () => nameField(200, "Supplier");
const supplierLotField = () => nameField(100, "Supplier lot number");
const expiresOnField = () => isoDate("The expiry date").nullable();
const measuredAssayField = () =>
  z
    .number({ error: "The measured assay must be a number (a mass fraction, 0–1)" })
    .gt(0, "The measured assay must be greater than 0")
    .max(1, "The measured assay is a mass fraction: at most 1")
    .nullable();

export const receiveLotSchema = z
  .strictObject({
    materialId: id("Material"),
    supplier: supplierField(),
    supplierLot: supplierLotField(),
    quantity: z
      .number({ error: "The quantity must be a number" })
      .positive("The quantity must be greater than 0")
      .max(1e9, "The quantity is too large"),
    unit: z.enum(LOT_UNITS, { error: 'The unit must be "g", "kg", "mL" or "L"' }),
    receivedOn: isoDate("The received date"),
    expiresOn: expiresOnField().optional(),
    measuredAssay: measuredAssayField().optional(),
    notes: notesField(5000).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.expiresOn && v.expiresOn < v.receivedOn) {
      ctx.addIssue({ code: "custom", path: ["expiresOn"], message: "The expiry date must not be before the received date" });
    }
  });
export type ReceiveLotInput = z.infer<typeof receiveLotSchema>;

/** The fields of a lot that a correction may change: never the material, the quantities or the received date. */
export const LOT_CORRECTION_FIELDS = ["supplier", "supplierLot", "expiresOn", "measuredAssay", "notes"] as const;

/**
 * A correction of a received lot (PATCH /api/lots/:id): the same rules and
 * messages as receiving, every field optional but at least one, and the
 * lot's `version` as read (a stale one is a 409). null clears the expiry
 * date, the measured assay or the notes. The expiry date against the
 * received date is checked with the stored lot.
 */
export const correctLotSchema = z
  .strictObject({
    version: z
      .number({ error: "The version must be a number (the lot's version as you read it)" })
      .int("The version must be a whole number")
      .min(1, "The version must be at least 1")
      .max(2_147_483_647, "The version is too large"),
    supplier: supplierField().optional(),
    supplierLot: supplierLotField().optional(),
    expiresOn: expiresOnField().optional(),
    measuredAssay: measuredAssayField().optional(),
    notes: notesField(5000).optional(),
  })
  .superRefine((v, ctx) => {
    if (LOT_CORRECTION_FIELDS.every((f) => v[f] === undefined)) {
      ctx.addIssue({ code: "custom", message: `Nothing to correct: send at least one of ${LOT_CORRECTION_FIELDS.join(", ")}` });
    }
  });
export type CorrectLotInput = z.infer<typeof correctLotSchema>;

const blankIsNull = (s: string) => (s.trim() === "" ? null : s.trim());

/**
 * The lot correction form's fields as typed (text; an empty date, assay or
 * notes clears it), checked with the rules and messages of the route.
 */
export const lotCorrectionFormSchema = z.object({
  supplier: supplierField(),
  supplierLot: supplierLotField(),
  expiresOn: z.string().transform(blankIsNull).pipe(expiresOnField()),
  measuredAssay: z
    .string()
    .transform((s) => (s.trim() === "" ? null : Number(s.trim().replace(",", "."))))
    .pipe(measuredAssayField()),
  notes: z.string().transform(blankIsNull).pipe(notesField(5000)),
});
export type LotCorrectionFormInput = z.input<typeof lotCorrectionFormSchema>;
export type LotCorrectionFormValues = z.output<typeof lotCorrectionFormSchema>;

export const lotListQuerySchema = z.object({
  materialId: z.string().max(36, "At most 36 characters").optional(),
  inStock: z.enum(["0", "1"], { error: 'inStock must be "0" or "1"' }).optional(),
});

export const chooseLotSchema = z.strictObject({ lotId: id("Lot").nullable() });

export const disposeSchema = z.strictObject({
  disposition: z.enum(BATCH_DISPOSITIONS, { error: 'The disposition must be "released", "rejected" or "released_under_deviation"' }),
  justification: notesField(5000, "Justification").optional(),
  acknowledgedDeviations: z
    .array(
      z.strictObject({
        lineIndex: z.number({ error: "The line index must be a number" }).int("The line index must be a whole number").min(0).max(10_000),
        note: nameField(2000, "Note"),
      }),
    )
    .max(500)
    .optional(),
});
export type DisposeInput = z.infer<typeof disposeSchema>;

export const traceFormatSchema = z.object({ format: z.enum(["csv", "xlsx"], { error: 'format must be "csv" or "xlsx"' }).optional() });
