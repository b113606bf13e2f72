/** zod schema of the team settings route (the team's currency). */
import { z } from "zod";
import { CURRENCY_CODE } from "@/lib/currency";

export const teamSettingsSchema = z.strictObject({
  currency: z
    .string({ error: "The currency must be a three-letter ISO 4217 code such as EUR, USD or GBP" })
    .trim()
    .toUpperCase()
    .regex(CURRENCY_CODE, "The currency must be a three-letter ISO 4217 code such as EUR, USD or GBP"),
});
