import Link from "next/link";
import { redirect } from "next/navigation";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { getActor } from "@/lib/auth/session";
import { listMemberships } from "@/lib/services/accounts/account.service";
import { getProfile } from "@/lib/services/accounts/profile.service";
import { Wordmark } from "@/components/ui/wordmark";
import { ROLE_LABELS } from "@/components/ui/format";
import { MainNav, type NavItem } from "./_components/main-nav";
import { OrganisationSwitcher } from "./_components/organisation-switcher";
import { Providers } from "./_components/providers";
import { SignOutButton } from "./_components/sign-out-button";

/** Signed-in shell: every page below re-checks the actor through its services. */
export default async function AppLayout({ children }: { children: ReactNode }) {
  await connection();
  const actor = await getActor();
  if (!actor) redirect("/sign-in");
  const [memberships, profile] = await Promise.all([listMemberships(actor.userId), getProfile(actor)]);
  const nav: NavItem[] = [
    { href: "/", label: "Portfolio" },
    { href: "/alerts", label: "Alerts" },
    { href: "/team", label: "Team" },
    { href: "/account", label: "Account" },
  ];
  return (
    <Providers>
      <div className="flex min-h-screen flex-col">
        <header className="bg-ink text-white print:hidden">
          <div className="mx-auto flex min-h-13 max-w-[1400px] flex-wrap items-center gap-x-5 gap-y-1 px-3 py-1.5 sm:px-5 sm:py-0">
            <Link href="/" className="shrink-0 text-white">
              <Wordmark />
            </Link>
            <MainNav items={nav} />
            <div className="ml-auto flex min-w-0 items-center gap-4">
              <OrganisationSwitcher memberships={memberships} currentId={actor.organisationId} />
              <span className="hidden text-sm text-white/60 sm:inline" data-testid="current-user">
                {profile.displayName} · <span data-testid="current-role">{ROLE_LABELS[actor.role]}</span>
              </span>
              <SignOutButton />
            </div>
          </div>
        </header>
        <main className="mx-auto w-full max-w-[1400px] flex-1 px-5 py-6">{children}</main>
      </div>
    </Providers>
  );
}
