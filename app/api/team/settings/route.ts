import { getTeamSettings, saveTeamSettings } from "@/db/queries/team-settings";
import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { teamSettingsSchema } from "@/lib/validations/team-settings";

/** GET /api/team/settings : { currency, isDefault } for any member (costs are shown in it). */
export const GET = route({ access: "member" }, async (_req, { team }) => {
  return Response.json(await getTeamSettings(team.id));
});

/** PUT /api/team/settings { currency } : team admins only; an ISO 4217 code such as "EUR". */
export const PUT = route({ permission: "organization:update" }, async (req, { actor }) => {
  return Response.json(await saveTeamSettings(actor, await readJson(req, teamSettingsSchema)));
});
