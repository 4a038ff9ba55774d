"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";

/** While the record waits or is analysed, re-render the server page every few seconds. */
export function PendingRefresher({ intervalMs = 3000 }: { intervalMs?: number }) {
  const router = useRouter();
  useEffect(() => {
    const t = setInterval(() => router.refresh(), intervalMs);
    return () => clearInterval(t);
  }, [router, intervalMs]);
  return null;
}
