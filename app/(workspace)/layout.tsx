import { redirect } from "next/navigation";
import type { ReactNode } from "react";
import { WorkspaceNav, type NavItem } from "@/components/layout/nav";
import { ROLE_LABELS } from "@/components/layout/role-words";
import { can } from "@/lib/permissions";
import { currentContext } from "@/components/layout/page-context";

/** Every workspace page: signed in, in a team; the nav shows what the role may open. */
export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const ctx = await currentContext();
  if (!ctx) redirect("/sign-in");
  if (!ctx.teamId) redirect("/create-team");

  const items: NavItem[] = [{ href: "/home", label: "Home" }];
  if (can(ctx.role, "formulation:readUnreleased")) items.push({ href: "/formulations", label: "Formulations" });
  items.push({ href: "/production", label: "Batch sheets" });
  if (can(ctx.role, "batch:read")) items.push({ href: "/batches", label: "Batch records" });
  items.push({ href: "/materials", label: "Materials" });
  if (can(ctx.role, "lot:read")) items.push({ href: "/lots", label: "Lots" });
  if (can(ctx.role, "audit:read")) items.push({ href: "/activity", label: "Activity" });
  items.push({ href: "/team", label: "Team" });

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-panel focus:px-3 focus:py-1">
        Skip to content
      </a>
      <WorkspaceNav items={items} teamName={ctx.teamName} userName={ctx.userName} roleLabel={ROLE_LABELS[ctx.role]} />
      <main id="main" className="mx-auto w-full max-w-[1400px] flex-1 px-4 py-5">
        {children}
      </main>
    </div>
  );
}
