"use client";

import { useState } from "react";
import { Button } from "./button";

/** Shows a secret (device key, API token) once, with a copy button and a clear warning. */
export function SecretOnce({ label, secret }: { label: string; secret: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="rounded-md border border-accent/30 bg-accent-soft p-3" data-secret-once>
      <div className="mb-1 text-xs font-medium text-accent-strong">{label} — shown once; store it now.</div>
      <div className="flex items-center gap-2">
        <code className="min-w-0 flex-1 break-all rounded bg-surface px-2 py-1 font-mono text-xs" data-secret>
          {secret}
        </code>
        <Button
          size="sm"
          onClick={() => {
            void navigator.clipboard?.writeText(secret).then(() => setCopied(true));
          }}
        >
          {copied ? "Copied" : "Copy"}
        </Button>
      </div>
    </div>
  );
}
