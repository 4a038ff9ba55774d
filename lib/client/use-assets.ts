"use client";

import useSWR from "swr";
import type { AssetSummary } from "@/lib/domain/types";
import { fetchJson } from "./fetch-json";

export const ASSETS_URL = "/api/v1/assets";

/** The organisation's assets for the Portfolio, from `GET /api/v1/assets`, refreshed every minute. */
export function useAssets(fallback?: AssetSummary[]) {
  const { data, error, isLoading, mutate } = useSWR<{ assets: AssetSummary[] }, Error>(
    ASSETS_URL,
    (url: string) => fetchJson<{ assets: AssetSummary[] }>(url),
    { refreshInterval: 60_000, fallbackData: fallback ? { assets: fallback } : undefined },
  );
  return { assets: data?.assets, error, isLoading, refresh: mutate };
}
