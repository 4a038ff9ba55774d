import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { ALERT_STATES, type AlertState } from "@/lib/domain/drift";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { listAlerts } from "@/lib/services/alerts/alert.service";
import { readEvidence } from "@/lib/services/alerts/evidence";
import { listAssets } from "@/lib/services/assets/asset.service";
import { listMembers } from "@/lib/services/team/team.service";
import { isUuid } from "@/lib/services/authz";
import { formatDateTime } from "@/components/ui/format";
import { PageHeader, Panel } from "@/components/ui/panel";
import { pageActor } from "../_lib/page-actor";
import { AlertFilters } from "./_components/alert-filters";
import { OUTCOME_LABELS } from "./_components/labels";
import { AlertStateBadge } from "./_components/state-badge";

export const metadata: Metadata = { title: "Alerts" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

/** Alerts inbox: alerts that are not closed first, then closed ones, newest first; filters in the URL. */
export default async function AlertsPage({ searchParams }: { searchParams: Promise<Search> }) {
  await connection();
  const sp = await searchParams;
  const actor = await pageActor();
  const assetId = one(sp.assetId) && isUuid(one(sp.assetId) ?? "") ? one(sp.assetId) : undefined;
  const state = ALERT_STATES.includes(one(sp.state) as AlertState) ? (one(sp.state) as AlertState) : undefined;
  const assigneeUserId = one(sp.assigneeUserId) && isUuid(one(sp.assigneeUserId) ?? "") ? one(sp.assigneeUserId) : undefined;
  const [organisation, alerts, assets, members] = await Promise.all([
    getOrganisation(actor), listAlerts(actor, { assetId, state, assigneeUserId, limit: 200 }), listAssets(actor), listMembers(actor),
  ]);
  const tz = organisation.timeZone;
  const names = Object.fromEntries(members.map((m) => [m.userId, m.displayName]));
  const assignees = members.filter((m) => m.role === "inspector").map((m) => ({ value: m.userId, label: m.displayName }));
  const openCount = alerts.filter((a) => a.state !== "closed").length;

  return (
    <>
      <PageHeader title="Alerts">
        {openCount === 1 ? "1 alert needs attention" : `${openCount} alerts need attention`} · times in {tz}
      </PageHeader>
      <Panel bodyClassName="p-0">
        <AlertFilters assets={assets.map((a) => ({ value: a.id, label: a.name }))} assignees={assignees}
          assetId={assetId} state={state} assigneeUserId={assigneeUserId} />
        {alerts.length === 0 ? (
          <p className="px-4 py-8 text-center text-sm text-muted">No alert matches these filters.</p>
        ) : (
          <ul className="divide-y divide-line" data-testid="alert-list">
            <li aria-hidden className="hidden grid-cols-[minmax(0,2fr)_minmax(0,1.3fr)_minmax(0,1fr)_minmax(0,1fr)_minmax(0,1.4fr)] gap-3 px-4 py-2 text-xs font-medium uppercase tracking-wide text-muted md:grid">
              <span>Asset</span><span>Raised</span><span>State</span><span>Assignee</span><span>Modes involved</span>
            </li>
            {alerts.map((a) => {
              const ev = readEvidence(a.evidence);
              const modes = (ev.modes.some((m) => m.beyond) ? ev.modes.filter((m) => m.beyond) : ev.modes).map((m) => m.label);
              const modeText = modes.length > 0 ? modes.join(", ") : ev.t2?.beyond ? "all modes (T²)" : "—";
              return (
                <li key={a.id} data-alert-row={a.id} data-alert-asset={a.assetName} data-state={a.state} className={a.state === "closed" ? "bg-canvas/50" : undefined}>
                  <Link href={`/alerts/${a.id}`}
                    className="grid grid-cols-[minmax(0,1fr)_auto] gap-x-3 gap-y-1 px-4 py-3 text-sm hover:bg-sunken md:grid-cols-[minmax(0,2fr)_minmax(0,1.3fr)_minmax(0,1fr)_minmax(0,1fr)_minmax(0,1.4fr)] md:items-center">
                    <span className="order-1 min-w-0 truncate font-medium text-accent md:order-none">{a.assetName}</span>
                    <span className="order-3 col-span-2 text-muted md:order-none md:col-span-1 md:text-ink"><span className="md:hidden">Raised </span>{formatDateTime(a.raisedAt, tz)}</span>
                    <span className="order-2 justify-self-end md:order-none md:justify-self-start">
                      <AlertStateBadge state={a.state} />
                      {a.outcome ? <span className="ml-1 hidden text-xs text-muted lg:inline">{OUTCOME_LABELS[a.outcome]}</span> : null}
                    </span>
                    <span className="order-4 col-span-2 text-muted md:order-none md:col-span-1 md:text-ink">
                      <span className="md:hidden">Assignee: </span>{a.assigneeUserId ? names[a.assigneeUserId] ?? "former member" : "nobody"}
                    </span>
                    <span className="order-5 col-span-2 text-muted md:order-none md:col-span-1 md:text-ink"><span className="md:hidden">Modes: </span>{modeText}</span>
                  </Link>
                </li>
              );
            })}
          </ul>
        )}
      </Panel>
    </>
  );
}
