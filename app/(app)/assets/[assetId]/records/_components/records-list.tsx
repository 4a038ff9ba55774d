"use client";

import Link from "next/link";
import { RecordStatusBadge, VerdictBadge } from "@/components/records/record-status";
import { formatDuration, formatTemperature } from "@/components/records/format";
import type { RecordPageView } from "@/components/records/types";
import { formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { Table, Td, Th } from "@/components/ui/table";
import { useRecords, type RecordsQuery } from "@/lib/client/use-records";

/** The asset's records, newest first, refreshed by polling while any is in progress. */
export function RecordsList({ assetId, query, initial, timeZone }: { assetId: string; query: RecordsQuery; initial: RecordPageView; timeZone: string }) {
  const { page, error } = useRecords(assetId, query, initial);
  const records = page?.records ?? [];
  return (
    <div>
      {error ? <Notice tone="error" className="m-3">Could not refresh the list: {error.message}</Notice> : null}
      <Table>
        <thead>
          <tr>
            <Th>Started</Th>
            <Th>Status</Th>
            <Th className="text-right">Duration</Th>
            <Th className="text-right">Channels</Th>
            <Th className="text-right">Temperature</Th>
            <Th>Quality</Th>
            <Th className="text-right">Modes</Th>
          </tr>
        </thead>
        <tbody>
          {records.map((r) => (
            <tr key={r.id} className="hover:bg-sunken/60" data-record-row={r.id} data-status={r.status}>
              <Td className="tabular-nums">
                <Link href={`/assets/${assetId}/records/${r.id}`} className="font-medium text-accent hover:underline">
                  {formatDateTime(r.startedAt, timeZone)}
                </Link>
                <div className="font-mono text-[11px] text-faint">{r.gatewayRecordId}</div>
              </Td>
              <Td>
                <RecordStatusBadge status={r.status} progress={r.progress} />
                {r.status === "failed" && r.failureReason ? <div className="max-w-64 truncate text-xs text-danger" title={r.failureReason}>{r.failureReason}</div> : null}
              </Td>
              <Td className="text-right tabular-nums">{formatDuration(r.durationS)}</Td>
              <Td className="text-right tabular-nums">{r.channelCount}</Td>
              <Td className="text-right tabular-nums">{formatTemperature(r.temperatureC)}</Td>
              <Td><VerdictBadge verdict={r.verdict} /></Td>
              <Td className="text-right tabular-nums">{r.modeCount ?? "—"}</Td>
            </tr>
          ))}
          {records.length === 0 ? (
            <tr>
              <Td colSpan={7} className="py-8 text-center text-muted">No records match these filters.</Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
    </div>
  );
}
