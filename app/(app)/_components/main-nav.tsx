"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cx } from "@/components/ui/cx";

export interface NavItem {
  href: string;
  label: string;
}

function isActive(pathname: string, href: string): boolean {
  if (href === "/") return pathname === "/" || pathname.startsWith("/assets");
  return pathname === href || pathname.startsWith(`${href}/`);
}

/** Top navigation; the items are chosen by role on the server. */
export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main" className="-mx-1 flex max-w-full items-center gap-1 overflow-x-auto px-1">
      {items.map((it) => {
        const active = isActive(pathname, it.href);
        return (
          <Link
            key={it.href}
            href={it.href}
            aria-current={active ? "page" : undefined}
            className={cx(
              "rounded-md px-2.5 py-1.5 text-sm font-medium transition-colors",
              active ? "bg-white/12 text-white" : "text-white/70 hover:text-white hover:bg-white/8",
            )}
          >
            {it.label}
          </Link>
        );
      })}
    </nav>
  );
}
