"use client";

import { useSession } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useSWRConfig } from "swr";
import type { Membership } from "@/lib/domain/types";
import { ROLE_LABELS } from "@/components/ui/format";

/**
 * Switches the current organisation for members of several: updates the session token
 * (the server checks the membership), then reloads server data and client caches.
 */
export function OrganisationSwitcher({
  memberships,
  currentId,
  variant = "dark",
}: {
  memberships: Membership[];
  currentId: string;
  variant?: "dark" | "light";
}) {
  const { update } = useSession();
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const [pending, startTransition] = useTransition();
  const [failed, setFailed] = useState(false);
  const current = memberships.find((m) => m.organisationId === currentId);

  if (memberships.length < 2) {
    return <span className={variant === "dark" ? "block max-w-[11rem] truncate text-sm text-white/80 sm:max-w-none" : "text-sm"}>{current?.organisationName ?? ""}</span>;
  }

  return (
    <span className="inline-flex items-center gap-2">
      <label className="sr-only" htmlFor={`org-switch-${variant}`}>
        Organisation
      </label>
      <select
        id={`org-switch-${variant}`}
        data-testid="organisation-switcher"
        value={currentId}
        disabled={pending}
        onChange={(e) => {
          const organisationId = e.target.value;
          setFailed(false);
          startTransition(async () => {
            const s = await update({ organisationId });
            const switched = (s as { organisationId?: unknown } | null)?.organisationId === organisationId;
            if (!switched) setFailed(true);
            await mutate(() => true, undefined, { revalidate: true });
            router.push("/");
            router.refresh();
          });
        }}
        className={
          variant === "dark"
            ? "h-8 max-w-[16rem] rounded-md border border-white/20 bg-white/10 px-2 text-sm text-white"
            : "h-9 rounded-md border border-line-strong bg-surface px-2 text-sm"
        }
      >
        {memberships.map((m) => (
          <option key={m.organisationId} value={m.organisationId} className="text-ink">
            {m.organisationName} ({ROLE_LABELS[m.role]})
          </option>
        ))}
      </select>
      {failed ? <span className="text-xs text-danger">Could not switch.</span> : null}
    </span>
  );
}
