/** zod schemas of the formulation and revision routes. */
import { z } from "zod";
import { REVISION_STATES } from "@/lib/enums";
import { formulationInputSchema } from "@/lib/formulation";
import { pageParam, pageSizeParam } from "./query";
import { lineTextField, nameField, notesField } from "./text";

export const formulationListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  state: z.enum(REVISION_STATES).optional(),
  project: z.string().trim().max(200).optional(),
  sort: z.enum(["name", "updatedAt", "state", "project"]).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  page: pageParam,
  pageSize: pageSizeParam(),
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
