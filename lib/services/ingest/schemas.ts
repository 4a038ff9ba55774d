/**
 * Input schemas of the gateway edges (upload contract in PRODUCT.md and the README).
 * Unknown keys are refused so a typo in a gateway's firmware shows up at once.
 */
import { z } from "zod";
import { ACCELERATION_UNITS } from "@/lib/domain/records";

/** Sampling rates accepted, Hz: ambient records are taken at 50–200 Hz; this leaves room both ways. */
export const SAMPLE_RATE_RANGE_HZ = [10, 2000] as const;

export const UploadRecordMeta = z.strictObject({
  /** The gateway's own id of the record, unique per gateway. */
  recordId: z.string().min(1).max(128).regex(/^[\x21-\x7e]+$/, "Use printable ASCII without spaces."),
  /** Optional: the asset the gateway believes it serves; another asset than its own answers 403. */
  assetId: z.uuid().optional(),
  startedAt: z.iso.datetime({ offset: true, message: "Use ISO 8601 with a time zone, e.g. 2026-03-01T12:00:00Z." }),
  sampleRateHz: z.number().min(SAMPLE_RATE_RANGE_HZ[0]).max(SAMPLE_RATE_RANGE_HZ[1]),
  channels: z.array(z.string().min(1).max(32)).min(1).max(256)
    .refine((c) => new Set(c).size === c.length, "Channel codes must be distinct."),
  units: z.enum(ACCELERATION_UNITS),
  /** Air or structure temperature at the record, °C; null when the gateway has no thermometer. */
  temperatureC: z.number().min(-90).max(90).nullable(),
  environment: z.strictObject({
    windSpeedMps: z.number().min(0).max(150).optional(),
    humidityPct: z.number().min(0).max(100).optional(),
  }).optional(),
});
export type UploadRecordMeta = z.infer<typeof UploadRecordMeta>;

export const GatewayHeartbeatInput = z.strictObject({
  /** The gateway's clock when it sent the heartbeat (ISO 8601); gives the clock offset. */
  sentAt: z.iso.datetime({ offset: true }).optional(),
  firmwareVersion: z.string().min(1).max(64).optional(),
});
export type GatewayHeartbeatInput = z.infer<typeof GatewayHeartbeatInput>;
