import type { Metadata } from "next";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { listAnalysisSettingsHistory } from "@/lib/services/analysis/settings.service";
import { DEFAULT_RATE_PERIOD_DAYS, getIdentificationRates } from "@/lib/services/tracking/identification-rate.service";
import { formatDateTime } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";
import { orNotFound } from "../../../_lib/or-not-found";
import { pageActor } from "../../../_lib/page-actor";
import { ReprocessRangeForm } from "./_components/reprocess-range-form";
import { SettingsForm } from "./_components/settings-form";
import { SettingsHistory, SettingsSummary } from "./_components/settings-summary";
import { TrackedModesTable } from "./_components/tracked-modes-table";
import { dayIn, ratePeriodOf, type TrackedModeRowView } from "./_lib/views";

export const metadata: Metadata = { title: "Analysis" };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

/** Asset › Analysis: settings (versioned), tracked modes with their identification rates, range reprocessing. */
export default async function AnalysisPage({ params, searchParams }: { params: Promise<{ assetId: string }>; searchParams: Promise<Search> }) {
  await connection();
  const [{ assetId }, sp] = await Promise.all([params, searchParams]);
  const actor = await pageActor();
  const tz = (await getOrganisation(actor)).timeZone;
  const now = new Date();
  const period = ratePeriodOf(one(sp.from), one(sp.to), tz, now, DEFAULT_RATE_PERIOD_DAYS);
  const [history, rates] = await Promise.all([
    orNotFound(listAnalysisSettingsHistory(actor, assetId)),
    orNotFound(getIdentificationRates(actor, assetId, { from: period.from, to: period.to })),
  ]);
  const [current, ...earlier] = history;
  const canSettings = can(actor.role, "settings:write");
  const canModes = can(actor.role, "mode:write");
  const canReprocess = can(actor.role, "record:reprocess");
  const rows: TrackedModeRowView[] = rates.modes.map((m) => ({
    id: m.id, label: m.label, nominalFrequencyHz: m.nominalFrequencyHz, bandLowHz: m.bandLowHz, bandHighHz: m.bandHighHz,
    source: m.sourceRecordId !== null && m.sourceModeIndex !== null ? { kind: "record", recordId: m.sourceRecordId, modeIndex: m.sourceModeIndex } : { kind: "design" },
    hasReferenceShape: m.referenceShape !== null, active: m.active, sought: m.sought, identified: m.identified, rate: m.rate,
    notSought: m.notSought, lastIdentifiedAt: m.lastIdentifiedAt ? m.lastIdentifiedAt.toISOString() : null,
  }));

  return (
    <div className="grid gap-5" data-testid="analysis-page">
      <Panel
        title="Analysis settings"
        actions={
          <span className="text-xs text-muted" data-testid="settings-version" data-version={current.version}>
            Version {current.version} · {current.createdByName ?? "defaults"} · {formatDateTime(current.createdAt, tz)}
          </span>
        }
      >
        {canSettings ? <SettingsForm assetId={assetId} values={current.form} /> : <SettingsSummary settings={current.settings} />}
        <SettingsHistory versions={earlier} timeZone={tz} />
      </Panel>

      <Panel title="Tracked modes" bodyClassName="p-0" actions={<span className="text-xs text-muted">Days in {tz}</span>}>
        <TrackedModesTable
          assetId={assetId} rows={rows} canEdit={canModes} timeZone={tz} period={period}
          summary={{ analysedRecords: rates.analysedRecords, unassignedModes: rates.unassignedModes, recordsWithUnassigned: rates.recordsWithUnassigned }}
        />
      </Panel>

      {canReprocess ? (
        <Panel title="Reprocess a date range">
          <p className="mb-3 text-sm text-muted">
            Analyse the records of a period again with the current settings (version {current.version}) and tracked modes.
          </p>
          <ReprocessRangeForm assetId={assetId} defaultFrom={dayIn(new Date(now.getTime() - 7 * 86_400_000), tz)} defaultTo={dayIn(now, tz)} timeZone={tz} />
        </Panel>
      ) : null}
    </div>
  );
}
