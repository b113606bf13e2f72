import useSWR from "swr";
import type { getTeamSettings } from "@/db/queries/team-settings";
import { DEFAULT_CURRENCY } from "@/lib/currency";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

/** The team's settings, as GET /api/team/settings sends them. */
export type TeamSettings = ApiData<typeof getTeamSettings>;

const URL = "/api/team/settings";

/** The team's settings (its currency). */
export function useTeamSettings() {
  return useSWR<TeamSettings>(URL, fetcher);
}

/** The team's currency code for showing costs; the default until the answer arrives. */
export function useTeamCurrency(): string {
  return useTeamSettings().data?.currency ?? DEFAULT_CURRENCY;
}

/** Saves the team's currency (admins only). */
export function saveTeamSettings(body: { currency: string }) {
  return apiSend("PUT", URL, body);
}
