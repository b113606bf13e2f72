import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { safeNextPath } from "@/lib/safe-next";
import { getContext } from "@/lib/session";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  // Only an invitation page is a place to return to after creating an account.
  const path = safeNextPath(params.next);
  const next = path.startsWith("/invitations/") ? path : null;
  const ctx = await getContext();
  if (ctx) redirect(next ?? (ctx.teamId ? "/home" : "/create-team"));
  return <SignUpForm next={next} />;
}
