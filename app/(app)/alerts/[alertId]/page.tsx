import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { getAlert } from "@/lib/services/alerts/alert.service";
import { listAttachments } from "@/lib/services/alerts/attachment.service";
import { readEvidence } from "@/lib/services/alerts/evidence";
import { listRecords } from "@/lib/services/analysis/records.service";
import { listMembers } from "@/lib/services/team/team.service";
import { ALERT_CAUTION } from "@/lib/email/templates/alert-raised";
import { ButtonLink } from "@/components/ui/button";
import { formatDate, formatDateTime } from "@/components/ui/format";
import { PageHeader, Panel } from "@/components/ui/panel";
import { orNotFound } from "../../_lib/or-not-found";
import { pageActor } from "../../_lib/page-actor";
import { OUTCOME_LABELS } from "../_components/labels";
import { AlertStateBadge } from "../_components/state-badge";
import { AcknowledgeForm, AssignForm, AttachForm, CloseForm, CommentForm, ScheduleForm } from "./_components/alert-forms";
import { AttachmentList } from "./_components/attachments";
import { EvidencePanel } from "./_components/evidence-panel";
import { Timeline } from "./_components/timeline";

export const metadata: Metadata = { title: "Alert" };

const DAY_MS = 86_400_000;
const RECORD_LINKS = 10;

/** Today's calendar day in the organisation's zone, YYYY-MM-DD (the earliest inspection date offered). */
function todayIn(timeZone: string): string {
  return new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).format(new Date());
}

/** One alert: the caution, the evidence snapshot, what happened, and the steps the actor's role allows. */
export default async function AlertPage({ params }: { params: Promise<{ alertId: string }> }) {
  await connection();
  const { alertId } = await params;
  const actor = await pageActor();
  const { alert, events } = await orNotFound(getAlert(actor, alertId));
  const evidence = readEvidence(alert.evidence);
  const windowEnd = evidence.pointTimeMs ?? alert.raisedAt.getTime();
  const windowStart = (evidence.windowStartMs ?? windowEnd) - DAY_MS;
  const [organisation, members, attachments, records] = await Promise.all([
    getOrganisation(actor), listMembers(actor), listAttachments(actor, alert.id),
    listRecords(actor, alert.assetId, { from: new Date(windowStart), to: new Date(windowEnd), limit: RECORD_LINKS }),
  ]);
  const tz = organisation.timeZone;
  const names = Object.fromEntries(members.map((m) => [m.userId, m.displayName]));
  const inspectors = members.filter((m) => m.role === "inspector" && !m.disabled).map((m) => ({ userId: m.userId, name: m.displayName }));
  const closed = alert.state === "closed";
  const mayWork = can(actor.role, "alert:work");
  const mayClose = can(actor.role, "alert:close");
  const mayBaseline = can(actor.role, "baseline:write");

  return (
    <>
      <PageHeader
        eyebrow={<Link href="/alerts" className="hover:underline">Alerts</Link>}
        title={<Link href={`/assets/${alert.assetId}`} className="hover:underline">{alert.assetName}</Link>}
        actions={<AlertStateBadge state={alert.state} />}
      >
        Raised {formatDateTime(alert.raisedAt, tz)} · times in {tz}
      </PageHeader>

      <section role="note" aria-label="Caution" data-testid="alert-caution"
        className="mb-5 rounded-lg border-l-4 border-amber-600 bg-amber-50 px-4 py-3 text-sm text-amber-950">
        <strong className="mb-0.5 block font-semibold">Caution</strong>
        {ALERT_CAUTION}
      </section>

      {closed && alert.outcome === "repaired" && mayBaseline ? (
        <div className="mb-5 flex flex-wrap items-center justify-between gap-3 rounded-lg border border-accent/30 bg-accent-soft px-4 py-3 text-sm">
          <span>The structure was repaired: its frequencies have changed, so drift needs a new baseline.</span>
          <ButtonLink href={`/assets/${alert.assetId}/baselines`} variant="primary" size="sm">Start a new baseline</ButtonLink>
        </div>
      ) : null}

      <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="min-w-0 space-y-5">
          <Panel title="Status">
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="alert-status">
              <dt className="text-muted">State</dt><dd><AlertStateBadge state={alert.state} /></dd>
              <dt className="text-muted">Assignee</dt><dd>{alert.assigneeUserId ? names[alert.assigneeUserId] ?? "former member" : "Nobody yet"}</dd>
              <dt className="text-muted">Inspection</dt><dd>{formatDate(alert.inspectionAt, tz)}</dd>
              {closed ? (
                <>
                  <dt className="text-muted">Outcome</dt><dd data-testid="alert-outcome">{OUTCOME_LABELS[alert.outcome ?? ""] ?? alert.outcome}</dd>
                  <dt className="text-muted">Closed</dt><dd>{formatDateTime(alert.closedAt, tz)}</dd>
                  <dt className="text-muted">Findings</dt><dd className="whitespace-pre-wrap break-words">{alert.findings}</dd>
                </>
              ) : null}
            </dl>
          </Panel>
          <Panel title="Evidence when raised">
            <EvidencePanel evidence={evidence} assetId={alert.assetId} timeZone={tz}
              records={records.records.map((r) => ({ id: r.record.id, startedAt: r.record.startedAt, status: r.record.status, verdict: r.latest?.verdict ?? null }))} />
          </Panel>
          <Panel title="Timeline">
            <Timeline names={names} timeZone={tz} events={events.map((e) => ({
              id: e.id, kind: e.kind, at: e.at.toISOString(), actorName: e.actorUserId ? names[e.actorUserId] ?? "former member" : null,
              // The raise event is written when the replay ran; the statistics it rests on are of the raise time.
              details: e.kind === "raised" ? { ...e.details, pointAt: alert.raisedAt.toISOString() } : e.details,
            }))} />
          </Panel>
        </div>

        <div className="min-w-0 space-y-5">
          {mayWork && !closed ? (
            <Panel title="Next steps">
              <div className="space-y-5 divide-line" data-testid="alert-steps">
                {alert.state === "open" ? <AcknowledgeForm alertId={alert.id} /> : null}
                <ScheduleForm alertId={alert.id} today={todayIn(tz)} />
                <AssignForm alertId={alert.id} inspectors={inspectors} current={alert.assigneeUserId} />
              </div>
            </Panel>
          ) : null}
          <Panel title="Photos and documents">
            <div className="space-y-4">
              <AttachmentList alertId={alert.id} timeZone={tz} items={attachments.map((a) => ({
                id: a.id, filename: a.filename, contentType: a.contentType, sizeBytes: a.sizeBytes, createdAt: a.createdAt.toISOString(),
                uploaderName: a.uploadedByUserId ? names[a.uploadedByUserId] ?? null : null,
              }))} />
              {mayWork ? <AttachForm alertId={alert.id} /> : null}
            </div>
          </Panel>
          {mayWork ? (
            <Panel title="Comment">
              <CommentForm alertId={alert.id} />
            </Panel>
          ) : null}
          {mayClose && !closed ? (
            <Panel title="Close with an outcome">
              <CloseForm alertId={alert.id} />
            </Panel>
          ) : null}
          {!mayWork ? <p className="text-sm text-muted">Your role reads alerts; inspectors and engineers work them.</p> : null}
        </div>
      </div>
    </>
  );
}
