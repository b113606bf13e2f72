"use client";

import Link from "next/link";
import { usePathname, useRouter } from "next/navigation";
import { authClient } from "@/lib/auth-client";

export interface NavItem {
  href: string;
  label: string;
}

interface WorkspaceNavProps {
  items: NavItem[];
  teamName: string;
  userName: string;
  roleLabel: string;
}

/** The top bar: team, plain-word sections, who is signed in. */
export function WorkspaceNav({ items, teamName, userName, roleLabel }: WorkspaceNavProps) {
  const pathname = usePathname();
  const router = useRouter();

  async function signOut() {
    await authClient.signOut();
    router.replace("/sign-in");
    router.refresh();
  }

  return (
    <header className="no-print border-b border-rule bg-panel">
      <div className="mx-auto flex max-w-[1400px] flex-wrap items-center gap-x-5 gap-y-1 px-4 py-2">
        <Link href="/home" className="flex items-center gap-1.5 font-semibold tracking-tight text-ink">
          <span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm bg-accent" />
          Gelwright
          <span className="hidden text-sm font-normal text-muted sm:inline">· {teamName}</span>
        </Link>
        <nav aria-label="Sections" className="order-3 w-full overflow-x-auto md:order-none md:w-auto">
          <ul className="flex gap-1">
            {items.map((item) => {
              const active = pathname === item.href || pathname.startsWith(`${item.href}/`);
              return (
                <li key={item.href}>
                  <Link
                    href={item.href}
                    aria-current={active ? "page" : undefined}
                    className={`block rounded px-2.5 py-1 text-sm whitespace-nowrap ${
                      active ? "bg-accent-soft font-medium text-accent" : "text-ink hover:bg-paper"
                    }`}
                  >
                    {item.label}
                  </Link>
                </li>
              );
            })}
          </ul>
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span className="text-muted">
            {userName} · <span className="text-ink">{roleLabel}</span>
          </span>
          <button type="button" onClick={signOut} className="text-accent underline underline-offset-2 decoration-rule hover:decoration-accent">
            Sign out
          </button>
        </div>
      </div>
    </header>
  );
}
