import "server-only";
import { redirect } from "next/navigation";
import { cache } from "react";
import { getContext, type TeamContext } from "@/lib/session";

/** getContext once per request, shared by the layout and the page. */
export const currentContext = cache(getContext);

/** The team context of a workspace page; redirects when signed out or without a team. */
export async function pageContext(): Promise<TeamContext> {
  const ctx = await currentContext();
  if (!ctx) redirect("/sign-in");
  if (!ctx.teamId) redirect("/create-team");
  return ctx;
}
