// Types of the parts of ./app.mjs that TypeScript scripts use (scripts/bench-ingest.ts).
export const APP_PROCESS_ENV: Record<string, string>;
export function nextBin(root: string): string;
export function buildIfNeeded(root: string, env: Record<string, string | undefined>, opts?: { force?: boolean; logFile?: string }): Promise<void>;
