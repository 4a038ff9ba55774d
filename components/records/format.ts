/** Number and label formatting of the Records screens (SI values in, display strings out). */
import type { RecordStatus } from "@/lib/domain/records";

export const STATUS_LABELS: Record<RecordStatus, string> = {
  received: "Received",
  queued: "Queued",
  analysing: "Analysing",
  analysed: "Analysed",
  rejected: "Rejected",
  failed: "Failed",
};

export const VERDICT_LABELS: Record<"accept" | "accept_without" | "reject", string> = {
  accept: "Accepted",
  accept_without: "Accepted without some channels",
  reject: "Rejected",
};

export function formatHz(f: number | null | undefined, digits = 3): string {
  return f === null || f === undefined || !Number.isFinite(f) ? "—" : `${f.toFixed(digits)} Hz`;
}

/** A damping ratio (fraction) as a percentage. */
export function formatDamping(z: number | null | undefined): string {
  return z === null || z === undefined || !Number.isFinite(z) ? "—" : `${(z * 100).toFixed(2)} %`;
}

export function formatRatio(v: number | null | undefined, digits = 3): string {
  return v === null || v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(digits);
}

export function formatDuration(s: number): string {
  if (!Number.isFinite(s)) return "—";
  const m = Math.floor(s / 60);
  const r = Math.round(s - m * 60);
  return m > 0 ? `${m} min${r ? ` ${r} s` : ""}` : `${r} s`;
}

export function formatTemperature(c: number | null): string {
  return c === null ? "—" : `${c.toFixed(1)} °C`;
}

export function formatSigned(v: number | null, digits = 2): string {
  if (v === null || !Number.isFinite(v)) return "—";
  return `${v >= 0 ? "+" : "−"}${Math.abs(v * 100).toFixed(digits)} %`;
}
