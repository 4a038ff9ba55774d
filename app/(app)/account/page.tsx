import type { Metadata } from "next";
import { connection } from "next/server";
import { listMemberships } from "@/lib/services/accounts/account.service";
import { listApiTokens } from "@/lib/services/accounts/api-token.service";
import { getOrganisation, getProfile } from "@/lib/services/accounts/profile.service";
import { listNotificationPrefs } from "@/lib/services/accounts/notification.service";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ROLE_LABELS } from "@/components/ui/format";
import { OrganisationSwitcher } from "../_components/organisation-switcher";
import { ChangePasswordForm } from "./_components/change-password-form";
import { NotificationForm } from "./_components/notification-form";
import { ProfileForm } from "./_components/profile-form";
import { TokenSection } from "./_components/token-section";
import { pageActor } from "../_lib/page-actor";

export const metadata: Metadata = { title: "Account" };

/** Account: the signed-in person's name, password, alert e-mails per asset, personal API tokens and organisations. */
export default async function AccountPage() {
  await connection();
  const actor = await pageActor();
  const [profile, tokens, memberships, organisation, notificationPrefs] = await Promise.all([
    getProfile(actor),
    listApiTokens(actor),
    listMemberships(actor.userId),
    getOrganisation(actor),
    listNotificationPrefs(actor),
  ]);
  return (
    <>
      <PageHeader title="Account">{profile.email}</PageHeader>
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="space-y-5">
          <Panel title="Profile">
            <ProfileForm displayName={profile.displayName} />
          </Panel>
          <Panel title="Password">
            <ChangePasswordForm email={profile.email} />
          </Panel>
          <Panel title="Alert e-mails">
            <NotificationForm prefs={notificationPrefs} />
          </Panel>
        </div>
        <div className="space-y-5">
          <Panel title="Organisation">
            <p className="mb-3 text-sm">
              You work in <strong>{organisation.name}</strong> as <strong>{ROLE_LABELS[actor.role]}</strong>.
            </p>
            {memberships.length > 1 ? (
              <div className="flex items-center gap-3 text-sm">
                <span className="text-muted">Switch to</span>
                <OrganisationSwitcher memberships={memberships} currentId={actor.organisationId} variant="light" />
              </div>
            ) : (
              <p className="text-xs text-faint">You belong to one organisation.</p>
            )}
          </Panel>
          <Panel title="Personal API tokens">
            <TokenSection
              tokens={tokens.map((t) => ({
                id: t.id,
                name: t.name,
                prefix: t.prefix,
                createdAt: t.createdAt.toISOString(),
                lastUsedAt: t.lastUsedAt ? t.lastUsedAt.toISOString() : null,
                revokedAt: t.revokedAt ? t.revokedAt.toISOString() : null,
              }))}
              timeZone={organisation.timeZone}
            />
          </Panel>
        </div>
      </div>
    </>
  );
}
