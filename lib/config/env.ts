import { z } from "zod";

/**
 * The only reader of process.env. Parsed once, on first use; a bad value fails at boot
 * with every problem listed, not on the first request that needs it.
 */
const Env = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  /** Demo mode shows demo sign-ins on the sign-in page. On for `npm start`, off by default. */
  MODEWARDEN_DEMO: z.enum(["0", "1"]).default("0").transform((v) => v === "1"),
  MODEWARDEN_DATA_DIR: z.string().min(1).default(".data"),
  PGHOST: z.string().default("127.0.0.1"),
  PGPORT: z.coerce.number().int().min(1).max(65535).default(54329),
  PGUSER: z.string().default("modewarden"),
  PGPASSWORD: z.string().default("modewarden"),
  PGDATABASE: z.string().default("modewarden"),
  REDIS_HOST: z.string().default("127.0.0.1"),
  REDIS_PORT: z.coerce.number().int().min(1).max(65535).default(63799),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  /** HTTP port of the local mail catcher's JSON listing (development and tests only). */
  MAIL_CATCHER_HTTP_PORT: z.coerce.number().int().min(1).max(65535).default(2580),
  /** Shows the caught-mail page /dev/mail (set by `npm start` and `npm test`, never in a real deployment). */
  MODEWARDEN_DEV_MAIL: z.enum(["0", "1"]).default("0").transform((v) => v === "1"),
  /** Port `npm start` serves the app on (127.0.0.1); APP_URL defaults to match it. */
  APP_PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  /** Debian's PostgreSQL 15 binaries, used by the launchers for the private cluster. */
  PG_BIN_DIR: z.string().default("/usr/lib/postgresql/15/bin"),
  /** Browser for the e2e tests (playwright-core launches it; Debian's chromium). */
  CHROMIUM_PATH: z.string().default("/usr/bin/chromium"),
  /**
   * Read only by scripts/test.mjs (listed here so every variable lives in one place): the
   * throw-away test stack's ports and folder (empty = a fresh folder under the OS temp dir).
   */
  TEST_PGPORT: z.coerce.number().int().min(1).max(65535).default(54339),
  TEST_REDIS_PORT: z.coerce.number().int().min(1).max(65535).default(63809),
  TEST_SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2535),
  TEST_MAIL_CATCHER_HTTP_PORT: z.coerce.number().int().min(1).max(65535).default(2590),
  TEST_APP_PORT: z.coerce.number().int().min(1).max(65535).default(3100),
  TEST_DATA_DIR: z.string().default(""),
  MAIL_FROM: z.string().default("Modewarden <no-reply@modewarden.local>"),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16).default("modewarden-development-secret-change-me"),
  /** Optional MapLibre style URL for users with their own tile server; empty = offline basemap. */
  MAP_STYLE_URL: z.string().default(""),
  STORAGE_DRIVER: z.enum(["fs", "s3"]).default("fs"),
  /** S3 driver (STORAGE_DRIVER=s3): endpoint URL of an S3-compatible store; empty = AWS for S3_REGION. */
  S3_ENDPOINT: z.string().default(""),
  /** S3 driver: bucket holding the raw records (must exist). */
  S3_BUCKET: z.string().default(""),
  S3_REGION: z.string().min(1).default("us-east-1"),
  /** S3 driver: static credentials; both empty = the SDK's default credential chain. */
  S3_ACCESS_KEY_ID: z.string().default(""),
  S3_SECRET_ACCESS_KEY: z.string().default(""),
  /** S3 driver: path-style addressing (http://host/bucket/key), needed by most S3-compatible stores. */
  S3_FORCE_PATH_STYLE: z.enum(["0", "1", "true", "false"]).default("0").transform((v) => v === "1" || v === "true"),
  LOG_LEVEL: z.enum(["debug", "info", "warn", "error"]).default("info"),
  /** Largest upload body accepted by POST /api/v1/records, bytes (compressed size as sent); default 64 MiB. */
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1024).default(64 * 1024 * 1024),
  /** Largest data part after gzip decompression, bytes; default 256 MiB. */
  UPLOAD_MAX_DECODED_BYTES: z.coerce.number().int().min(1024).default(256 * 1024 * 1024),
  /** Uploads accepted per gateway per minute (Redis fixed window); more answer 429 with Retry-After. */
  UPLOAD_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(120),
  /** Analysis jobs one worker process runs at once. */
  ANALYSIS_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
  /** Seconds between sweeps that re-enqueue records left pending without a live job. */
  ANALYSIS_SWEEP_INTERVAL_S: z.coerce.number().int().min(5).default(60),
  /**
   * Seconds after which a running analysis job whose worker died (no lock renewal) is handed
   * to another worker: BullMQ's lock duration and stalled-job check interval.
   */
  ANALYSIS_STALL_TIMEOUT_S: z.coerce.number().int().min(2).max(600).default(30),
});

export type Env = z.infer<typeof Env>;

let cached: Env | null = null;

/** Parse and cache the environment; throws with every invalid variable listed. */
export function env(): Env {
  if (cached) return cached;
  const parsed = Env.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  if (parsed.data.NODE_ENV === "production" && parsed.data.NEXTAUTH_SECRET.startsWith("modewarden-development")) {
    throw new Error("Invalid environment:\n  NEXTAUTH_SECRET: must be set in production");
  }
  cached = parsed.data;
  return cached;
}

/** Drop the cache (tests that change process.env between cases). */
export function resetEnvForTests(): void {
  cached = null;
}
