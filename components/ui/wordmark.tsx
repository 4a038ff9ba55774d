import { cx } from "./cx";

/** The product's name with its small wave mark. */
export function Wordmark({ size = "md", className }: { size?: "md" | "lg"; className?: string }) {
  const px = size === "lg" ? 30 : 22;
  return (
    <span className={cx("inline-flex items-center gap-2 font-semibold tracking-tight", size === "lg" ? "text-xl" : "text-[15px]", className)}>
      <svg width={px} height={px} viewBox="0 0 32 32" aria-hidden>
        <rect width="32" height="32" rx="7" fill="#18212b" />
        <path d="M5 20 Q9 9 13 20 T21 20 T27 14" fill="none" stroke="#7fd1c6" strokeWidth="2.4" strokeLinecap="round" />
        <path d="M6 25 H26" stroke="#f3f4f1" strokeWidth="1.6" strokeLinecap="round" />
      </svg>
      Modewarden
    </span>
  );
}
