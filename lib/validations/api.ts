import { z } from "zod";
import { formulationInputSchema, materialSchema } from "@/lib/formulation";
import { ROLE_NAMES } from "@/lib/permissions";
import { batchNotesSchema, recordLineSchema, startBatchSchema } from "@/lib/spreadsheet/api-schemas";
import { AUDIT_ACTIONS, REVISION_STATES } from "@/lib/enums";
import { lineTextField, nameField, notesField } from "./text";

const page = z.coerce.number().int().min(1).max(100_000).optional();
const pageSize = z.coerce.number().int().min(1).max(200).optional();

export const formulationListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  state: z.enum(REVISION_STATES).optional(),
  project: z.string().trim().max(200).optional(),
  sort: z.enum(["name", "updatedAt", "state", "project"]).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  page,
  pageSize,
});

export const createFormulationSchema = z.strictObject({
  name: nameField(200),
  project: lineTextField(200, "Project"),
  description: notesField(5000, "Description").optional(),
  input: formulationInputSchema,
});

export const saveDraftSchema = z.strictObject({
  version: z.number().int().min(1),
  input: formulationInputSchema,
});

export const reviewCommentSchema = z.strictObject({
  comment: z.string().trim().max(5000).nullish(),
});

export const diffQuerySchema = z.object({
  from: z.coerce.number().int().min(1),
  to: z.coerce.number().int().min(1),
});

export const materialListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  kind: z.enum(["precursor", "organic", "substrate", "solvent", "water", "catalyst"]).optional(),
  sort: z.enum(["name", "kind", "updatedAt"]).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  page,
  pageSize: z.coerce.number().int().min(1).max(500).optional(),
});

const casNumber = z
  .string()
  .trim()
  .regex(/^\d{2,7}-\d{2}-\d$/, "A CAS number looks like 78-10-4")
  .nullish();

export const materialBodySchema = z.strictObject({
  material: materialSchema,
  casNumber,
});

export const roleSchema = z.enum(ROLE_NAMES as [string, ...string[]]);

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const inviteSchema = z.strictObject({
  email: z.email("Enter an e-mail address").max(255),
  role: roleSchema,
});

export const createTeamSchema = z.strictObject({ name: nameField(120, "Team name") });

export const auditQuerySchema = z.object({
  entityId: z.string().max(36).optional(),
  entityType: z.string().max(32).optional(),
  actorId: z.string().max(36).optional(),
  action: z.enum(AUDIT_ACTIONS, { error: "action is not one of the recorded events" }).optional(),
  from: z.coerce.date().optional(),
  to: z.coerce.date().optional(),
  page,
  pageSize,
});

/*
 * The batch routes' schemas (lib/spreadsheet/api-schemas.ts) with the shared
 * text rule on what people type into a batch record.
 */
export const startBatchBodySchema = startBatchSchema.extend({ notes: notesField(5000).optional() });
export const recordLineBodySchema = recordLineSchema.extend({
  lotNumber: lineTextField(100, "Lot number"),
  initials: lineTextField(10, "Initials"),
});
export const batchNotesBodySchema = batchNotesSchema.extend({ notes: notesField(5000) });

/** Parses URL search params with a schema (422 on bad values). */
export function parseQuery<T>(url: string, schema: z.ZodType<T>): T {
  const params = Object.fromEntries(new URL(url).searchParams.entries());
  return schema.parse(params);
}
