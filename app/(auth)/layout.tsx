import type { ReactNode } from "react";
import { Wordmark } from "@/components/ui/wordmark";

/** Signed-out pages: a narrow column on the canvas, the wordmark above. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center px-4 pt-[12vh] pb-12">
      <div className="mb-6">
        <Wordmark size="lg" />
      </div>
      <div className="w-full max-w-sm">{children}</div>
      <p className="mt-10 max-w-sm text-center text-xs text-faint">
        Modal parameters of footbridges, towers and masts, tracked from ambient vibration records.
      </p>
    </main>
  );
}
