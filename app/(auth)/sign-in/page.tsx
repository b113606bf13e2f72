import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { safeNextPath } from "@/lib/safe-next";
import { getContext } from "@/lib/session";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const next = safeNextPath(params.next);
  const ctx = await getContext();
  if (ctx?.teamId) redirect(next);
  if (ctx) redirect(next.startsWith("/invitations/") ? next : "/create-team");
  return <SignInForm next={next} reset={params.reset === "done"} />;
}
