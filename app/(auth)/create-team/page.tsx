import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { CreateTeamForm } from "@/components/auth/create-team-form";
import { getContext } from "@/lib/session";

export const metadata: Metadata = { title: "Create your team" };

export default async function CreateTeamPage() {
  const ctx = await getContext();
  if (!ctx) redirect("/sign-in?next=/create-team");
  if (ctx.teamId) redirect("/home");
  return <CreateTeamForm userName={ctx.userName} />;
}
