import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { listAudit, listInvitations, listMembers } from "@/lib/services/team/team.service";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { PageHeader, Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";
import { InviteForm } from "./_components/invite-form";
import { MemberTable } from "./_components/member-table";
import { PendingInvitations } from "./_components/pending-invitations";
import { pageActor } from "../_lib/page-actor";

export const metadata: Metadata = { title: "Team" };

/** Team: members of the current organisation; admins invite, change roles and remove. */
export default async function TeamPage() {
  await connection();
  const actor = await pageActor();
  const canWrite = can(actor.role, "team:write");
  const [members, organisation, audit, invitations] = await Promise.all([
    listMembers(actor),
    getOrganisation(actor),
    can(actor.role, "audit:read") ? listAudit(actor, { limit: 15 }) : Promise.resolve(null),
    canWrite ? listInvitations(actor) : Promise.resolve(null),
  ]);
  const tz = organisation.timeZone;
  return (
    <>
      <PageHeader title="Team" eyebrow={organisation.name}>
        {canWrite ? "Invite people by e-mail and choose what each one may do." : "Who works in this organisation, and in which role."}
      </PageHeader>
      <div className="grid gap-5 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="space-y-5">
          <Panel title={`Members (${members.length})`} bodyClassName="p-0">
            <MemberTable
              members={members.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() }))}
              canWrite={canWrite}
              selfId={actor.userId}
              timeZone={tz}
            />
          </Panel>
          {audit ? (
            <Panel title="Recent activity" bodyClassName="p-0">
              <Table>
                <thead>
                  <tr>
                    <Th>When</Th>
                    <Th>Who</Th>
                    <Th>What</Th>
                  </tr>
                </thead>
                <tbody>
                  {audit.map((e) => (
                    <tr key={e.id}>
                      <Td className="whitespace-nowrap tabular-nums text-muted">{formatDateTime(e.at, tz)}</Td>
                      <Td>{e.actorLabel ?? "System"}</Td>
                      <Td className="font-mono text-[13px]">{e.action}</Td>
                    </tr>
                  ))}
                  {audit.length === 0 ? (
                    <tr>
                      <Td colSpan={3} className="py-6 text-center text-muted">
                        Nothing recorded yet.
                      </Td>
                    </tr>
                  ) : null}
                </tbody>
              </Table>
            </Panel>
          ) : null}
        </div>
        {canWrite ? (
          <div className="space-y-5">
            <Panel title="Invite a member">
              <InviteForm />
            </Panel>
            {invitations ? (
              <Panel title={`Pending invitations (${invitations.length})`} bodyClassName="p-0">
                <PendingInvitations
                  invitations={invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString() }))}
                  timeZone={tz}
                />
              </Panel>
            ) : null}
          </div>
        ) : null}
      </div>
    </>
  );
}
