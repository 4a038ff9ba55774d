/**
 * Serviceability at a glance (reusable: the serviceability page and the Asset Overview):
 * the caution and the "no code verification" note always; footbridges: each tracked mode
 * against the comfort threshold and resonance ranges, damping against guidance, peak and
 * 1-s RMS accelerations against the recommended maxima; towers, masts and chimneys: the
 * vortex-shedding critical speed of each first bending mode, damping against Table F.2 and
 * the lock-in candidates. Presentational: it takes the service's plain view.
 */
import type { ServiceabilityAssessment } from "@/lib/serviceability/assess";
import { NOT_CODE_VERIFICATION, SERVICEABILITY_CAUTION } from "@/lib/serviceability/caution";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { hz, mps, mps2, pct } from "./format";

const RISK_TEXT = { high: "in resonance range", second_harmonic: "in 2nd-harmonic range", outside: "outside ranges" } as const;
const DAMPING_TEXT = { below_guidance: "below guidance minimum", within_guidance: "between minimum and mean", above_guidance: "above guidance mean" } as const;

function Tag({ tone, children }: { tone: "warn" | "ok" | "info"; children: React.ReactNode }) {
  const cls = tone === "warn" ? "bg-danger-soft text-danger" : tone === "ok" ? "bg-success-soft text-success" : "bg-sunken text-muted";
  return <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-medium ${cls}`}>{children}</span>;
}

export function ServiceabilityCaution() {
  return (
    <div className="space-y-1 rounded-md border border-line bg-sunken px-3 py-2 text-xs text-muted" data-testid="serviceability-caution">
      <p><strong className="text-ink">Caution.</strong> {SERVICEABILITY_CAUTION}</p>
      <p>{NOT_CODE_VERIFICATION}</p>
    </div>
  );
}

function FootbridgeModes({ view }: { view: ServiceabilityAssessment }) {
  const f = view.values.frequency;
  return (
    <div>
      <h3 className="mb-1 text-sm font-semibold">Frequencies against pedestrian comfort</h3>
      <p className="mb-2 text-xs text-muted">
        Comfort check when vertical &lt; {f.comfortCheckVerticalHz} Hz or lateral/torsional &lt; {f.comfortCheckHorizontalHz} Hz (EN 1990 Annex A2, A2.4.3.2).
        Resonance ranges: vertical {f.verticalRiskHz[0]}–{f.verticalRiskHz[1]} Hz, 2nd harmonic {f.verticalSecondHarmonicHz[0]}–{f.verticalSecondHarmonicHz[1]} Hz,
        lateral {f.lateralRiskHz[0]}–{f.lateralRiskHz[1]} Hz (European footbridge guidance, from memory; verify).
      </p>
      <Table>
        <thead><tr><Th>Mode</Th><Th>Direction</Th><Th>Measured (median)</Th><Th>Comfort check</Th><Th>Resonance</Th><Th>Damping (median)</Th></tr></thead>
        <tbody>
          {view.modes.map((m) => (
            <tr key={m.trackedModeId} data-testid="serviceability-mode">
              <Td>{m.label}</Td>
              <Td>{m.direction ?? <span className="text-faint">unknown</span>}{m.directionFrom && m.directionFrom !== "label" ? <span className="text-xs text-faint"> (from {m.directionFrom})</span> : null}</Td>
              <Td>{m.measuredMedianHz !== null ? hz(m.measuredMedianHz) : <span className="text-faint">{hz(m.nominalFrequencyHz)} nominal</span>}</Td>
              <Td>{m.frequencyCheck ? (m.frequencyCheck.comfortCheckNeeded ? <Tag tone="warn">needed (&lt; {m.frequencyCheck.thresholdHz} Hz)</Tag> : <Tag tone="ok">not needed</Tag>) : "—"}</Td>
              <Td>{m.frequencyCheck ? <Tag tone={m.frequencyCheck.risk === "outside" ? "ok" : "warn"}>{RISK_TEXT[m.frequencyCheck.risk]}</Tag> : "—"}</Td>
              <Td>{pct(m.damping.medianRatio)} {m.damping.verdict ? <Tag tone={m.damping.verdict === "below_guidance" ? "warn" : "info"}>{DAMPING_TEXT[m.damping.verdict]}</Tag> : null}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}

function Accelerations({ view }: { view: ServiceabilityAssessment }) {
  const a = view.acceleration;
  if (!a) return null;
  return (
    <div>
      <h3 className="mb-1 text-sm font-semibold">Deck accelerations against recommended maxima</h3>
      <p className="mb-2 text-xs text-muted">
        Per record, the largest peak |a| and the largest 1-s RMS; {a.recordsWithLevels} of {a.recordsTotal} analysed records in the period carry levels.
        Maxima from EN 1990 Annex A2, A2.4.3.2 (recommended values).
      </p>
      <Table>
        <thead><tr><Th>Axis</Th><Th>Maximum</Th><Th>Peak: median / 95 % / max</Th><Th>Records above</Th><Th>1-s RMS: median / 95 % / max</Th></tr></thead>
        <tbody>
          {a.axes.map((x) => (
            <tr key={x.axis} data-testid={`acceleration-${x.axis}`}>
              <Td>{x.axis}</Td>
              <Td>{mps2(x.limitMps2)}{x.crowdLimitMps2 !== null ? <span className="text-xs text-muted"> (crowd {mps2(x.crowdLimitMps2)})</span> : null}</Td>
              <Td>{x.peak.count ? `${mps2(x.peak.median)} / ${mps2(x.peak.p95)} / ${mps2(x.peak.max)}` : <span className="text-faint">no levels</span>}</Td>
              <Td>{x.peak.count ? <Tag tone={x.peak.exceedCount ? "warn" : "ok"}>{x.peak.exceedCount} of {x.peak.count}</Tag> : "—"}</Td>
              <Td>{x.rms1s.count ? `${mps2(x.rms1s.median)} / ${mps2(x.rms1s.p95)} / ${mps2(x.rms1s.max)}` : "—"}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}

function TowerChecks({ view }: { view: ServiceabilityAssessment }) {
  const v = view.vortex;
  if (!v) return null;
  const candidates = v.episodes.filter((e) => e.classification === "lock_in_candidate");
  return (
    <div className="space-y-4">
      <div>
        <h3 className="mb-1 text-sm font-semibold">Vortex shedding</h3>
        <p className="mb-2 text-xs text-muted">
          v_crit = b·n/St with St = {v.strouhal} (EN 1991-1-4 Annex E). Section width b: {v.sectionWidthM !== null ? `${v.sectionWidthM} m` : "not set (an engineer sets it below)"}.
          {" "}{v.recordsWithWind} records in the period report a wind speed{v.maxWindMps !== null ? ` (highest ${mps(v.maxWindMps)})` : ""}.
        </p>
        <Table>
          <thead><tr><Th>First bending mode</Th><Th>Axis</Th><Th>Frequency</Th><Th>v_crit</Th><Th>Wind band</Th><Th>Records in band</Th></tr></thead>
          <tbody>
            {v.modes.map((m) => (
              <tr key={m.trackedModeId} data-testid="vortex-mode">
                <Td>{m.label}</Td><Td>{m.axis ?? "—"}</Td><Td>{hz(m.frequencyHz)}</Td>
                <Td>{mps(m.vCritMps)}</Td><Td>{m.bandMps ? `${m.bandMps[0].toFixed(2)}–${m.bandMps[1].toFixed(2)} m/s` : "—"}</Td><Td>{m.recordsInBand}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
        <p className="mt-2 text-sm" data-testid="lock-in-summary">
          {candidates.length ? <Tag tone="warn">{candidates.length} possible lock-in episode{candidates.length > 1 ? "s" : ""}</Tag> : <Tag tone="ok">no possible lock-in episode</Tag>}
          <span className="ml-2 text-xs text-muted">Wind within ±{Math.round(view.values.vortex.lockInBandFraction * 100)} % of v_crit and a narrow-band horizontal response (crest factor ≤ {view.values.vortex.narrowBandMaxCrest}).</span>
        </p>
      </div>
      <div>
        <h3 className="mb-1 text-sm font-semibold">Damping against EN 1991-1-4 Table F.2</h3>
        <Table>
          <thead><tr><Th>Mode</Th><Th>ζ (median)</Th><Th>δ = 2πζ/√(1−ζ²)</Th><Th>Table F.2 δs</Th><Th /></tr></thead>
          <tbody>
            {view.modes.map((m) => (
              <tr key={m.trackedModeId}>
                <Td>{m.label}</Td><Td>{pct(m.damping.medianRatio)}</Td><Td>{m.damping.logDecrement?.toFixed(4) ?? "—"}</Td>
                <Td>{view.dampingGuidance?.logDecrement?.toFixed(3) ?? "—"}</Td>
                <Td>{m.damping.verdict ? <Tag tone={m.damping.verdict === "below_guidance" ? "warn" : "info"}>{m.damping.verdict === "below_guidance" ? "below δs" : "at or above δs"}</Tag> : null}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </div>
    </div>
  );
}

/** The panel. `periodLabel` describes the period the view covers ("last 30 days"). */
export function ServiceabilityPanel({ view, periodLabel, compact = false }: { view: ServiceabilityAssessment; periodLabel: string; compact?: boolean }) {
  const g = view.dampingGuidance;
  return (
    <Panel title={`Serviceability indication — ${periodLabel}`} className="mb-4">
      <div className="space-y-4" data-testid="serviceability-panel" data-family={view.family}>
        <ServiceabilityCaution />
        {view.family === "other" ? <p className="text-sm text-muted">No serviceability rules apply to this kind of asset.</p> : null}
        {view.family === "footbridge" ? <FootbridgeModes view={view} /> : null}
        {view.family === "footbridge" && !compact ? <Accelerations view={view} /> : null}
        {view.family === "tower" ? <TowerChecks view={view} /> : null}
        {g && !compact ? (
          <p className="text-xs text-muted">
            Damping guidance: {g.label}{g.guessed ? " (guessed from the asset's material)" : ""} —{" "}
            {g.logDecrement !== null ? `δs = ${g.logDecrement} (ζ = ${pct(g.lowRatio)})` : `ζ minimum ${pct(g.lowRatio)}, mean ${pct(g.highRatio)}`}; {g.source}.
          </p>
        ) : null}
      </div>
    </Panel>
  );
}
