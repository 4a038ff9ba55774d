import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

export interface GatewayHeartbeat {
  lastHeartbeatAt: Date | null;
  firmwareVersion: string | null;
  clockOffsetMs: number | null;
}

/** Record a heartbeat: last seen and heartbeat time, firmware (kept when not sent) and clock offset. */
export async function recordGatewayHeartbeat(
  db: Db, gatewayId: string, at: Date, firmwareVersion: string | null, clockOffsetMs: number | null,
): Promise<GatewayHeartbeat> {
  const [row] = await withDbErrors(() =>
    db("gateways")
      .where({ id: gatewayId })
      .update({
        last_seen_at: at, last_heartbeat_at: at, clock_offset_ms: clockOffsetMs,
        firmware_version: firmwareVersion === null ? db.raw("firmware_version") : firmwareVersion,
      })
      .returning(["last_heartbeat_at", "firmware_version", "clock_offset_ms"]),
  );
  const r = row as { last_heartbeat_at: Date | null; firmware_version: string | null; clock_offset_ms: number | null } | undefined;
  return { lastHeartbeatAt: r?.last_heartbeat_at ?? null, firmwareVersion: r?.firmware_version ?? null, clockOffsetMs: r?.clock_offset_ms ?? null };
}
