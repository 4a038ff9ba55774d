import Link from "next/link";
import type { GatewayContact, OpenAlertRow } from "@/lib/db/repos/overview.repo";
import { formatDateTime } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";

const STATE_WORDS: Record<string, string> = { open: "Open", acknowledged: "Acknowledged", inspection_scheduled: "Inspection scheduled", closed: "Closed" };

const latest = (...ds: (Date | null)[]) => ds.filter((d): d is Date => d !== null).sort((a, b) => b.getTime() - a.getTime())[0] ?? null;

/** Gateways of the asset with their last contact: the latest of an upload or heartbeat seen and the newest record's start. */
export function GatewaysPanel({ gateways, timeZone, expectedIntervalMin, now }: { gateways: GatewayContact[]; timeZone: string; expectedIntervalMin: number; now: Date }) {
  return (
    <Panel title="Gateways" bodyClassName="p-0">
      <ul className="divide-y divide-line/70" data-testid="overview-gateways">
        {gateways.map((g) => {
          const last = latest(g.lastSeenAt, g.lastHeartbeatAt, g.lastRecordAt);
          const late = !g.revokedAt && (!last || now.getTime() - last.getTime() > expectedIntervalMin * 60_000);
          return (
            <li key={g.id} className="px-4 py-2.5 text-sm" data-gateway={g.id}>
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <span className="font-medium">{g.name}</span>
                <span className={g.revokedAt ? "text-xs text-muted" : late ? "text-xs font-medium text-danger" : "text-xs text-success"}>
                  {g.revokedAt ? `revoked ${formatDateTime(g.revokedAt, timeZone)}` : late ? "no contact within the expected interval" : "in contact"}
                </span>
              </div>
              <div className="text-xs text-muted">
                Last contact {formatDateTime(last, timeZone)} · last heartbeat {formatDateTime(g.lastHeartbeatAt, timeZone)} · newest record {formatDateTime(g.lastRecordAt, timeZone)}
                {g.firmwareVersion ? ` · firmware ${g.firmwareVersion}` : ""} · key {g.keyPrefix}…
              </div>
            </li>
          );
        })}
        {gateways.length === 0 ? <li className="px-4 py-4 text-sm text-muted">No gateway registered.</li> : null}
      </ul>
    </Panel>
  );
}

/** Alerts of the asset that are not closed, each linking to its page. */
export function OpenAlertsPanel({ alerts, timeZone }: { alerts: OpenAlertRow[]; timeZone: string }) {
  return (
    <Panel title="Open alerts" bodyClassName="p-0">
      <ul className="divide-y divide-line/70" data-testid="overview-alerts">
        {alerts.map((a) => (
          <li key={a.id} className="px-4 py-2.5 text-sm" data-alert-id={a.id}>
            <Link href={`/alerts/${a.id}`} className="font-medium text-accent hover:underline">
              Alert raised {formatDateTime(a.raisedAt, timeZone)}
            </Link>
            <div className="text-xs text-muted">
              {STATE_WORDS[a.state] ?? a.state}
              {a.assigneeLabel ? ` · assigned to ${a.assigneeLabel}` : ""}
              {a.inspectionAt ? ` · inspection ${formatDateTime(a.inspectionAt, timeZone)}` : ""}
            </div>
          </li>
        ))}
        {alerts.length === 0 ? <li className="px-4 py-4 text-sm text-muted">No open alert.</li> : null}
      </ul>
    </Panel>
  );
}
