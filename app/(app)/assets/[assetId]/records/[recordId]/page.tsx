import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { can } from "@/lib/auth/permissions";
import { getAsset, listChannels } from "@/lib/services/assets/asset.service";
import { getOrganisation } from "@/lib/services/accounts/profile.service";
import { getRecordDetail } from "@/lib/services/analysis/records.service";
import type { Asset } from "@/lib/domain/types";
import { formatDuration, formatTemperature, VERDICT_LABELS } from "@/components/records/format";
import { QualityTable } from "@/components/records/quality-table";
import { RecordStatusBadge, VerdictBadge } from "@/components/records/record-status";
import type { Vec3 } from "@/components/records/shape-geometry";
import { formatDateTime } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { orNotFound } from "../../../../_lib/or-not-found";
import { pageActor } from "../../../../_lib/page-actor";
import { toRecordDetailView } from "../_lib/views";
import { PendingRefresher } from "./_components/pending-refresher";
import { FrfPanelBody, StabilisationPanelBody } from "./_components/record-charts";
import { RecordControls } from "./_components/record-controls";
import { RecordWorkbench } from "./_components/record-workbench";

export const metadata: Metadata = { title: "Record" };

/** Fixed points of the drawing: a bridge's two abutments, a tower's base. */
function supportsOf(asset: Asset): Vec3[] {
  const bridge = asset.kind === "footbridge" || asset.kind === "pedestrian_bridge";
  if (bridge && asset.mainDimensionM) return [{ x: 0, y: 0, z: 0 }, { x: asset.mainDimensionM, y: 0, z: 0 }];
  if (asset.kind === "tower" || asset.kind === "mast" || asset.kind === "chimney") return [{ x: 0, y: 0, z: 0 }];
  return [];
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs uppercase tracking-wide text-muted">{label}</dt>
      <dd className="mt-0.5 text-sm tabular-nums">{children}</dd>
    </div>
  );
}

/** Record: spectra with picked peaks, the modal table, the mode shape, stabilisation, FRF and quality. */
export default async function RecordPage({ params }: { params: Promise<{ assetId: string; recordId: string }> }) {
  await connection();
  const { assetId, recordId } = await params;
  const actor = await pageActor();
  const [detail, asset, channels, organisation] = await Promise.all([
    orNotFound(getRecordDetail(actor, assetId, recordId)),
    orNotFound(getAsset(actor, assetId)),
    orNotFound(listChannels(actor, assetId)),
    getOrganisation(actor),
  ]);
  const tz = organisation.timeZone;
  const view = toRecordDetailView(detail, channels);
  const r = view.record;
  const a = view.analysis;
  const pending = r.status === "received" || r.status === "queued" || r.status === "analysing";
  const canReprocess = can(actor.role, "record:reprocess");
  const canTrack = can(actor.role, "mode:write");

  return (
    <div className="grid gap-5" data-testid="record-page" data-status={r.status}>
      {pending ? <PendingRefresher /> : null}
      <Panel
        title={
          <span>
            <Link href={`/assets/${assetId}/records`} className="font-normal text-muted hover:text-accent hover:underline">Records</Link>
            {" / "}
            <span data-testid="record-started">{formatDateTime(r.startedAt, tz)}</span>
          </span>
        }
        actions={canReprocess && !pending ? <RecordControls assetId={assetId} recordId={r.id} failed={r.status === "failed"} /> : null}
      >
        <dl className="grid grid-cols-2 gap-4 sm:grid-cols-4 lg:grid-cols-8">
          <Fact label="Status"><RecordStatusBadge status={r.status} progress={r.progress} /></Fact>
          <Fact label="Quality"><VerdictBadge verdict={r.verdict} /></Fact>
          <Fact label="Duration">{formatDuration(r.durationS)}</Fact>
          <Fact label="Sample rate">{r.sampleRateHz} Hz</Fact>
          <Fact label="Channels">{r.channelCount}</Fact>
          <Fact label="Temperature">{formatTemperature(r.temperatureC)}</Fact>
          <Fact label="Gateway record">{<span className="font-mono text-xs">{r.gatewayRecordId}</span>}</Fact>
          <Fact label="Settings">
            {a ? `v${a.settingsVersion}` : "—"}
            {detail.currentSettingsVersion !== null && a && detail.currentSettingsVersion !== a.settingsVersion ? (
              <span className="block text-xs text-muted">current v{detail.currentSettingsVersion}</span>
            ) : null}
          </Fact>
        </dl>
        {r.status === "failed" ? (
          <Notice tone="error" className="mt-4">Analysis failed{r.failureReason ? `: ${r.failureReason}` : "."}</Notice>
        ) : null}
        {pending ? <Notice className="mt-4">This record is {r.status === "analysing" ? "being analysed" : "waiting for analysis"}; the page updates by itself.</Notice> : null}
        {a && a.verdict !== "accept" ? (
          <Notice tone={a.verdict === "reject" ? "error" : "info"} className="mt-4">
            {VERDICT_LABELS[a.verdict]}{a.verdictNote ? ` — ${a.verdictNote}` : ""}
          </Notice>
        ) : null}
        {a && a.warnings.length ? (
          <details className="mt-3 text-sm text-muted">
            <summary className="cursor-pointer">Analysis notes ({a.warnings.length})</summary>
            <ul className="mt-1 list-disc pl-5">{a.warnings.map((w) => <li key={w}>{w}</li>)}</ul>
          </details>
        ) : null}
        {a ? <p className="mt-3 text-xs text-faint">Analysed {formatDateTime(a.analysedAt, tz)} ({tz}).</p> : null}
      </Panel>

      {a ? (
        <>
          <RecordWorkbench
            assetId={assetId} recordId={r.id} analysis={a} tracked={view.trackedModes} layout={view.layout}
            supports={supportsOf(asset)} canTrack={canTrack}
          />
          {a.stabilisation && a.stabilisation.length ? (
            <Panel title="Stabilisation diagram (SSI-COV)">
              <StabilisationPanelBody points={a.stabilisation} tracked={view.trackedModes} maxFrequencyHz={a.spectra?.frequencyHz.at(-1)} />
            </Panel>
          ) : null}
          {a.frf ? (
            <Panel title="Frequency response (H1), phase and coherence">
              <FrfPanelBody frf={a.frf} />
            </Panel>
          ) : null}
          <Panel title="Data quality per channel" bodyClassName="p-0">
            <QualityTable channels={a.quality} units={r.units} />
          </Panel>
        </>
      ) : null}
    </div>
  );
}
