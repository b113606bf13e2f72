import { readJson } from "@/lib/http/body";
import { route } from "@/lib/http/route";
import { createTeam } from "@/lib/teams";
import { createTeamSchema } from "@/lib/validations/team";

/** Creates a team; any signed-in person may (a new account starts its own). Its creator becomes its admin. */
export const POST = route({ access: "signed-in" }, async (req, { user }) => {
  const { name } = await readJson(req, createTeamSchema);
  return Response.json(await createTeam(req.headers, user.id, name), { status: 201 });
});
