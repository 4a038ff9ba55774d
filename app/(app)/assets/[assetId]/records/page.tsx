import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { listRecords } from "@/lib/services/analysis/records.service";
import { RECORD_STATUSES, type RecordStatus } from "@/lib/domain/records";
import { buttonClass } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { zonedDayStart } from "@/components/records/zoned-day";
import type { RecordsQuery } from "@/lib/client/use-records";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { RecordsFilters } from "./_components/records-filters";
import { RecordsList } from "./_components/records-list";
import { toRecordPageView } from "./_lib/views";

export const metadata: Metadata = { title: "Records" };

const PAGE_SIZE = 25;

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

/** Asset › Records: every uploaded record, newest first, with its status and analysis summary. */
export default async function RecordsPage({ params, searchParams }: { params: Promise<{ assetId: string }>; searchParams: Promise<Search> }) {
  await connection();
  const [{ assetId }, sp] = await Promise.all([params, searchParams]);
  const actor = await pageActor();
  const organisation = await getOrganisation(actor);
  const tz = organisation.timeZone;

  // URL → query: days are the organisation's days; `to` is inclusive, so it ends at the next day's start.
  const status = RECORD_STATUSES.includes(one(sp.status) as RecordStatus) ? one(sp.status) : undefined;
  const fromDay = one(sp.from);
  const toDay = one(sp.to);
  const errors: Record<string, string[]> = {};
  const from = fromDay ? zonedDayStart(fromDay, tz) : null;
  const to = toDay ? zonedDayStart(toDay, tz, 1) : null;
  if (fromDay && !from) errors.from = ["Use a day such as 2026-03-01."];
  if (toDay && !to) errors.to = ["Use a day such as 2026-03-31."];
  if (from && to && from >= to) errors.to = ["The last day must not be before the first."];
  const cursor = one(sp.cursor);
  const query: RecordsQuery = {
    status, cursor, limit: PAGE_SIZE,
    from: from ? from.toISOString() : undefined,
    to: to && !errors.to ? to.toISOString() : undefined,
  };

  const page = await orNotFound(listRecords(actor, assetId, {
    status: query.status as RecordStatus | undefined, from: query.from ? new Date(query.from) : undefined,
    to: query.to ? new Date(query.to) : undefined, cursor, limit: PAGE_SIZE,
  }));
  const initial = toRecordPageView(page);
  const base = `/assets/${assetId}/records`;
  const keep = new URLSearchParams();
  if (status) keep.set("status", status);
  if (fromDay) keep.set("from", fromDay);
  if (toDay) keep.set("to", toDay);
  const withCursor = (c: string) => {
    const p = new URLSearchParams(keep);
    p.set("cursor", c);
    return `${base}?${p.toString()}`;
  };
  const firstPage = keep.toString() ? `${base}?${keep.toString()}` : base;

  return (
    <Panel title="Records" bodyClassName="p-0" actions={<span className="text-xs text-muted">Times in {tz}</span>}>
      <RecordsFilters basePath={base} status={status} from={fromDay} to={toDay} errors={errors} />
      <RecordsList key={JSON.stringify(query)} assetId={assetId} query={query} initial={initial} timeZone={tz} />
      <nav aria-label="Pages" className="flex items-center justify-between gap-3 px-3 py-3 text-sm">
        {cursor ? <Link href={firstPage} className={buttonClass("secondary", "sm")}>Newest</Link> : <span />}
        {initial.nextCursor ? (
          <Link href={withCursor(initial.nextCursor)} className={buttonClass("secondary", "sm")} rel="next">Older records</Link>
        ) : <span className="text-xs text-faint">End of the list</span>}
      </nav>
    </Panel>
  );
}
