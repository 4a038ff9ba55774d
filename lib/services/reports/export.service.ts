/**
 * Exports of an asset's modal history (issue 6 part 4): every identified frequency of the
 * period with damping, temperature and the baseline's prediction, from the drift view (not
 * thinned). Everyone in the organisation reads; another organisation's asset is not_found.
 */
import type { Actor } from "@/lib/domain/types";
import { modalHistoryCsv, type ModalHistoryRow } from "@/lib/reports/modal-history-csv";
import { getDriftView } from "@/lib/services/drift/drift-view.service";

export async function exportModalHistory(actor: Actor, assetId: string, range: { from?: Date; to?: Date }): Promise<{ csv: string; filename: string; rows: number }> {
  const view = await getDriftView(actor, assetId, range, { maxPointsPerMode: Number.POSITIVE_INFINITY });
  const rows: ModalHistoryRow[] = view.modes.flatMap((m) => m.points.map((p) => ({
    atMs: p.atMs, label: m.label, trackedModeId: m.trackedModeId, frequencyHz: p.frequencyHz, dampingRatio: p.dampingRatio,
    temperatureC: p.temperatureC, predictedHz: p.predictedHz, residualHz: p.residualHz, outOfEnvelope: p.outOfEnvelope,
  })));
  const day = (d: Date | undefined) => (d ? d.toISOString().slice(0, 10) : "all");
  return { csv: modalHistoryCsv(rows), filename: `modal-history-${day(range.from)}-${day(range.to)}.csv`, rows: rows.length };
}
