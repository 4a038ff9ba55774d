import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";
import type { ModeDirection } from "@/lib/serviceability/footbridge-frequency";
import type { DesignMode } from "@/lib/serviceability/types";

const COLS = [
  "id", "asset_id", "label", "frequency_hz", "direction", "shape", "tracked_mode_id", "source_note", "created_at", "updated_at",
] as const;

interface DesignModeRow {
  id: string; asset_id: string; label: string; frequency_hz: number; direction: ModeDirection | null;
  shape: Record<string, number> | null; tracked_mode_id: string | null; source_note: string | null; created_at: Date; updated_at: Date;
}

const toDesignMode = (r: DesignModeRow): DesignMode => ({
  id: r.id, assetId: r.asset_id, label: r.label, frequencyHz: r.frequency_hz, direction: r.direction, shape: r.shape,
  trackedModeId: r.tracked_mode_id, sourceNote: r.source_note, createdAt: r.created_at, updatedAt: r.updated_at,
});

export type DesignModeWrite = Pick<DesignMode, "label" | "frequencyHz" | "direction" | "shape" | "trackedModeId" | "sourceNote">;

const toRow = (m: Partial<DesignModeWrite>) => {
  const out: Record<string, unknown> = {};
  if (m.label !== undefined) out.label = m.label;
  if (m.frequencyHz !== undefined) out.frequency_hz = m.frequencyHz;
  if (m.direction !== undefined) out.direction = m.direction;
  if (m.shape !== undefined) out.shape = m.shape === null ? null : JSON.stringify(m.shape);
  if (m.trackedModeId !== undefined) out.tracked_mode_id = m.trackedModeId;
  if (m.sourceNote !== undefined) out.source_note = m.sourceNote;
  return out;
};

/** Design modes of an asset, ascending in frequency. */
export async function listDesignModesOfAsset(db: Db, assetId: string): Promise<DesignMode[]> {
  const rows = await withDbErrors(() =>
    db<DesignModeRow>("design_modes").select(...COLS).where({ asset_id: assetId }).orderBy([{ column: "frequency_hz" }, { column: "id" }]),
  );
  return rows.map(toDesignMode);
}

export async function findDesignModeById(db: Db, id: string): Promise<DesignMode | null> {
  const row = await withDbErrors(() => db<DesignModeRow>("design_modes").select(...COLS).where({ id }).first());
  return row ? toDesignMode(row) : null;
}

/** Insert a design mode; a label already used on the asset raises AppError('conflict'). */
export async function insertDesignMode(db: Db, assetId: string, createdBy: string | null, m: DesignModeWrite): Promise<DesignMode> {
  const [row] = await withDbErrors(() =>
    db("design_modes").insert({ asset_id: assetId, created_by: createdBy, ...toRow(m) }).returning(COLS),
  );
  return toDesignMode(row as DesignModeRow);
}

export async function updateDesignModeById(db: Db, id: string, patch: Partial<DesignModeWrite>): Promise<DesignMode | null> {
  const [row] = await withDbErrors(() =>
    db("design_modes").where({ id }).update({ ...toRow(patch), updated_at: db.fn.now() }).returning(COLS),
  );
  return row ? toDesignMode(row as DesignModeRow) : null;
}

export async function deleteDesignModeById(db: Db, id: string): Promise<boolean> {
  const n = await withDbErrors(() => db("design_modes").where({ id }).delete());
  return n > 0;
}
