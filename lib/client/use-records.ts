"use client";

import useSWR from "swr";
import type { RecordPageView } from "@/components/records/types";
import { fetchJson } from "./fetch-json";

export interface RecordsQuery {
  status?: string;
  /** ISO instants (the page has already turned the chosen days into the organisation's zone). */
  from?: string;
  to?: string;
  cursor?: string;
  limit?: number;
}

/** `GET /api/v1/assets/:assetId/records` with the list's filters as query parameters. */
export function recordsUrl(assetId: string, q: RecordsQuery): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== "") p.set(k, String(v));
  const qs = p.toString();
  return `/api/v1/assets/${encodeURIComponent(assetId)}/records${qs ? `?${qs}` : ""}`;
}

const PENDING = new Set(["received", "queued", "analysing"]);

/**
 * One page of an asset's records, polled: every 3 s while a record on the page is still
 * being received or analysed, else every 30 s (new uploads appear on the first page).
 */
export function useRecords(assetId: string, query: RecordsQuery, fallback?: RecordPageView) {
  const url = recordsUrl(assetId, query);
  const { data, error, isLoading, mutate } = useSWR<RecordPageView, Error>(url, (u: string) => fetchJson<RecordPageView>(u), {
    fallbackData: fallback,
    refreshInterval: (latest) => (latest?.records.some((r) => PENDING.has(r.status)) ? 3_000 : 30_000),
    keepPreviousData: true,
  });
  return { page: data, error, isLoading, refresh: mutate };
}
