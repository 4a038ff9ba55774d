"use client";

import { SessionProvider } from "next-auth/react";
import type { ReactNode } from "react";

/** Client context for the signed-in area (session updates for the organisation switch). */
export function Providers({ children }: { children: ReactNode }) {
  return <SessionProvider refetchOnWindowFocus={false}>{children}</SessionProvider>;
}
