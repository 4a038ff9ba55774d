"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { ModalTable } from "@/components/records/modal-table";
import { ModeShapeView } from "@/components/records/mode-shape-view";
import { SpectrumChart } from "@/components/records/spectrum-chart";
import { formatHz } from "@/components/records/format";
import type { Vec3 } from "@/components/records/shape-geometry";
import type { AnalysisView, LayoutChannel, TrackedModeView } from "@/components/records/types";
import { TrackModeForm } from "./track-mode-form";

/**
 * The interactive part of the Record page: the spectrum (click a peak), the modal table
 * (click a row; engineers get "Track this mode") and the selected mode's shape.
 */
export function RecordWorkbench({
  assetId, recordId, analysis, tracked, layout, supports, canTrack,
}: {
  assetId: string;
  recordId: string;
  analysis: AnalysisView;
  tracked: TrackedModeView[];
  layout: LayoutChannel[];
  supports: Vec3[];
  canTrack: boolean;
}) {
  const [selected, setSelected] = useState<number | null>(analysis.modes[0]?.modeIndex ?? null);
  const [tracking, setTracking] = useState<number | null>(null);
  const mode = analysis.modes.find((m) => m.modeIndex === selected) ?? null;
  return (
    <div className="grid gap-5">
      <Panel title="Singular value spectra" actions={<span className="text-xs text-muted">Δf {analysis.lineSpacingHz.toFixed(4)} Hz · {analysis.averages} averages · click a peak to select its mode</span>}>
        {analysis.spectra && analysis.spectra.s1.length ? (
          <SpectrumChart spectra={analysis.spectra} modes={analysis.modes} tracked={tracked} selected={selected} onSelect={setSelected} />
        ) : (
          <p className="text-sm text-muted">No spectra: frequency-domain decomposition did not run on this record.</p>
        )}
      </Panel>
      <Panel title={`Identified modes (${analysis.modes.length})`} bodyClassName="p-0">
        <ModalTable
          modes={analysis.modes}
          selected={selected}
          onSelect={setSelected}
          renderAction={canTrack ? (m) => (m.tracked ? null : (
            <Button size="sm" variant="quiet" onClick={() => { setSelected(m.modeIndex); setTracking(m.modeIndex); }}>Track this mode</Button>
          )) : undefined}
          renderExpanded={canTrack ? (m) => (tracking === m.modeIndex && !m.tracked ? (
            <TrackModeForm assetId={assetId} recordId={recordId} mode={m} onDone={() => setTracking(null)} />
          ) : null) : undefined}
        />
      </Panel>
      <Panel title="Mode shape">
        {mode ? (
          <ModeShapeView
            layout={layout}
            shape={mode.shape}
            supports={supports}
            title={`Mode ${mode.modeIndex + 1} · ${formatHz(mode.frequencyHz)}${mode.tracked ? ` · ${mode.tracked.label}` : ""}`}
          />
        ) : (
          <p className="text-sm text-muted">Select a mode to draw its shape.</p>
        )}
      </Panel>
    </div>
  );
}
