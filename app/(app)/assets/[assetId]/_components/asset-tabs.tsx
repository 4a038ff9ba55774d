"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cx } from "@/components/ui/cx";

/** Section links of an asset; only sections that exist are listed. */
export function AssetTabs({ assetId }: { assetId: string }) {
  const pathname = usePathname();
  const base = `/assets/${assetId}`;
  const tabs = [
    { href: base, label: "Overview" },
    { href: `${base}/trends`, label: "Trends" },
    { href: `${base}/records`, label: "Records" },
    { href: `${base}/analysis`, label: "Analysis" },
    { href: `${base}/baselines`, label: "Baselines" },
    { href: `${base}/history`, label: "History import" },
    { href: `${base}/serviceability`, label: "Serviceability" },
    { href: `${base}/design`, label: "Design" },
    { href: `${base}/report`, label: "Report" },
    { href: `${base}/sensors`, label: "Sensors" },
    { href: `${base}/gateways`, label: "Gateways" },
  ];
  return (
    <nav aria-label="Asset sections" className="mb-5 flex gap-1 overflow-x-auto border-b border-line print:hidden">
      {tabs.map((t) => {
        const active = t.href === base ? pathname === base || pathname === `${base}/edit` : pathname.startsWith(t.href);
        return (
          <Link
            key={t.href}
            href={t.href}
            aria-current={active ? "page" : undefined}
            className={cx(
              "-mb-px shrink-0 whitespace-nowrap border-b-2 px-3 py-2 text-sm font-medium",
              active ? "border-accent text-ink" : "border-transparent text-muted hover:text-ink",
            )}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
