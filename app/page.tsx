import { redirect } from "next/navigation";
import { getContext } from "@/lib/session";

/** The front door: home when signed in, otherwise sign in. */
export default async function RootPage() {
  const ctx = await getContext();
  if (!ctx) redirect("/sign-in");
  redirect(ctx.teamId ? "/home" : "/create-team");
}
