"use client";

/**
 * The browser's way to a lot's stock adjustments: the URL in one place, the
 * change as a plain function, types as the query answers them.
 */
import type { adjustLot, listLotAdjustments } from "@/db/queries/lot-adjustments";
import type { LotAdjustmentReason } from "@/lib/enums";
import { apiSend } from "./fetcher";
import type { ApiData } from "./json";

export type LotAdjustments = ApiData<typeof listLotAdjustments>;
export type LotAdjusted = ApiData<typeof adjustLot>;

/** The adjustments route of one lot. */
export const lotAdjustmentsUrl = (lotId: string) => `/api/lots/${encodeURIComponent(lotId)}/adjustments`;

/** Sets the lot's quantity on hand to what was counted, with the lot's version as read. */
export function adjustLotStock(lotId: string, body: { version: number; quantityOnHand: number; reason: LotAdjustmentReason; note?: string | null }) {
  return apiSend<LotAdjusted>("POST", lotAdjustmentsUrl(lotId), body);
}
