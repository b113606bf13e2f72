/** zod schemas of the materials library routes. */
import { z } from "zod";
import { MATERIAL_KINDS, materialSchema } from "@/lib/formulation";
import { pageParam, pageSizeParam } from "./query";

export const materialListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  kind: z.enum(MATERIAL_KINDS).optional(),
  sort: z.enum(["name", "kind", "updatedAt"]).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  page: pageParam,
  pageSize: pageSizeParam(500),
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
