import type { ReactNode } from "react";
import { cx } from "./cx";

const TONES = {
  info: "border-accent/25 bg-accent-soft text-accent-strong",
  error: "border-danger/30 bg-danger-soft text-danger",
  success: "border-success/30 bg-success-soft text-success",
} as const;

/** A boxed message above or inside a form; `role` makes screen readers announce it. */
export function Notice({ tone = "info", children, className }: { tone?: keyof typeof TONES; children: ReactNode; className?: string }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={cx("rounded-md border px-3 py-2 text-sm", TONES[tone], className)}>
      {children}
    </div>
  );
}
