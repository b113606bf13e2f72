import { db } from "@/db";
import { copyReferenceMaterials } from "@/db/queries/library";
import { readJson, route, unauthorized } from "@/lib/api";
import { auth } from "@/lib/auth";
import { fromAuthError } from "@/lib/auth-errors";
import { getContext } from "@/lib/session";
import { createTeamSchema } from "@/lib/validations/api";

/** Creates a team; its creator becomes its admin, and its library starts from the reference materials. */
export const POST = route(async (req) => {
  const ctx = await getContext(req.headers);
  if (!ctx) throw unauthorized();
  const { name } = await readJson(req, createTeamSchema);
  const base = name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "team";
  const slug = `${base}-${crypto.randomUUID().slice(0, 6)}`;
  let team: { id: string; name: string; slug: string } | null;
  try {
    team = await auth.api.createOrganization({ headers: req.headers, body: { name, slug } });
    if (team) await auth.api.setActiveOrganization({ headers: req.headers, body: { organizationId: team.id } });
  } catch (err) {
    throw fromAuthError(err);
  }
  if (!team) throw new Error("team not created");
  await copyReferenceMaterials(db, team.id, ctx.userId);
  return Response.json({ id: team.id, name: team.name, slug: team.slug }, { status: 201 });
});
