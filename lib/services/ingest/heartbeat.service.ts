/**
 * Gateway heartbeats: last seen, firmware and the gateway clock's offset against the server
 * (positive = the gateway is ahead). A clock offset of 1 ms rotates a 10 Hz mode by 3.6°
 * between gateways [practice, REFERENCES.md §Data quality], so it is worth recording.
 */
import { db } from "@/lib/db/knex";
import { recordGatewayHeartbeat } from "@/lib/db/repos/gateway-heartbeat.repo";
import type { DeviceActor } from "@/lib/services/assets/gateway.service";
import type { GatewayHeartbeatInput } from "./schemas";

export interface HeartbeatAnswer {
  gatewayId: string;
  serverTime: string;
  clockOffsetMs: number | null;
  firmwareVersion: string | null;
}

export async function recordHeartbeat(device: DeviceActor, input: GatewayHeartbeatInput, receivedAt = new Date()): Promise<HeartbeatAnswer> {
  const offset = input.sentAt ? new Date(input.sentAt).getTime() - receivedAt.getTime() : null;
  const hb = await recordGatewayHeartbeat(db(), device.gatewayId, receivedAt, input.firmwareVersion ?? null, offset);
  return { gatewayId: device.gatewayId, serverTime: receivedAt.toISOString(), clockOffsetMs: hb.clockOffsetMs, firmwareVersion: hb.firmwareVersion };
}
