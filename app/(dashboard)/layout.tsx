import type { ReactNode } from "react";

import { pageAccess } from "@/lib/server/auth/access-table";
import { decideAccess } from "@/lib/server/auth/guards";
import { roleLabels } from "@/lib/server/auth/permissions";
import { getRequestContext } from "@/lib/server/auth/request-context";

import { NavLinks, type NavItem } from "./_components/nav-links";
import { OrganizationSwitcher } from "./_components/organization-switcher";
import { SignOutButton } from "./_components/sign-out-button";

const areas: NavItem[] = [
  { href: "/schedules", label: "Schedules" },
  { href: "/review", label: "Review" },
  { href: "/integrations", label: "Integrations" },
  { href: "/settings", label: "Settings" },
  { href: "/people", label: "People" },
];

export default async function DashboardLayout({ children }: { children: ReactNode }) {
  const context = await getRequestContext();
  // Each page's requirePage sends a visitor without a session to sign-in, keeping the address to return to.
  if (!context) return <>{children}</>;
  // Navigation shows only what the active role may open; each page checks again itself.
  const visible = areas.filter((a) => decideAccess(pageAccess[a.href as keyof typeof pageAccess], context) === "allow");
  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-sheet focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-rule bg-sheet print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <span className="text-base font-semibold tracking-tight">
            Sag<span className="text-action">line</span>
          </span>
          <NavLinks items={visible} />
          <div className="ml-auto flex items-center gap-3">
            {context.active ? (
              <OrganizationSwitcher
                activeId={context.active.organizationId}
                options={context.memberships.map((m) => ({ id: m.organizationId, name: m.organizationName }))}
              />
            ) : null}
            <span className="text-xs text-ink-soft" data-testid="who">
              {context.user.name}
              {context.active ? ` · ${roleLabels[context.active.role]}` : ""}
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-6xl px-4 py-6">
        {context.active ? null : (
          <p className="mb-4 text-ink-soft">You are not a member of any organization any more. Ask an administrator to invite you.</p>
        )}
        {children}
      </main>
    </div>
  );
}
