"use client";

import { FrfCharts } from "@/components/records/frf-charts";
import { StabilisationChart } from "@/components/records/stabilisation-chart";
import type { FrfView, StabilisationPointView, TrackedModeView } from "@/components/records/types";

/** Client wrappers so the server page can place the optional charts. */
export function StabilisationPanelBody(props: { points: StabilisationPointView[]; tracked: TrackedModeView[]; maxFrequencyHz?: number }) {
  return <StabilisationChart {...props} />;
}

export function FrfPanelBody({ frf }: { frf: FrfView }) {
  return <FrfCharts frf={frf} />;
}
