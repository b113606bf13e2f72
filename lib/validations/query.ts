/** Pieces shared by the list and download queries of several routes. */
import { z } from "zod";

/** ?page= of a paged list, from 1. */
export const pageParam = z.coerce.number().int().min(1).max(100_000).optional();

/** ?pageSize= of a paged list, at most `max` rows. */
export const pageSizeParam = (max = 200) => z.coerce.number().int().min(1).max(max).optional();

/** ?format=xlsx|csv of a download (the default is the route's). */
export const downloadQuerySchema = z.object({ format: z.enum(["xlsx", "csv"], { error: 'format must be "xlsx" or "csv"' }).optional() });
