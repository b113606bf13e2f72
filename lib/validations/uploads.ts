/** zod schemas of the fields sent with an upload: a spreadsheet import or a PDF attachment. */
import { z } from "zod";
import { IMPORT_KINDS } from "@/lib/enums";

export const importKindSchema = z.enum(IMPORT_KINDS, { error: 'kind must be "formulation" or "materials"' });

export const ATTACHMENT_OWNER_TYPES = ["material", "batch", "lot"] as const;
export const ATTACHMENT_KINDS = ["sds", "coa", "other"] as const;

export const attachmentOwnerTypeSchema = z.enum(ATTACHMENT_OWNER_TYPES, { error: 'ownerType must be "material", "batch" or "lot"' });

export const attachmentOwnerSchema = z.object({
  ownerType: attachmentOwnerTypeSchema,
  ownerId: z.string().trim().min(1, "Required").max(36, "At most 36 characters"),
});

export const attachmentKindSchema = z.enum(ATTACHMENT_KINDS, {
  error: 'kind must be "sds" (safety data sheet), "coa" (certificate of analysis) or "other"',
});
