import type { AssetCondition } from "@/lib/domain/types";

/**
 * Condition colours of PRODUCT.md, defined once. The map paints with the hex values (WebGL
 * cannot read CSS variables); everything else uses the CSS variables the root layout
 * injects from this table (`var(--condition-steady)` …).
 */
export interface ConditionStyle {
  label: string;
  /** Fill colour; commissioning is drawn as an outline, so its fill is the page colour. */
  fill: string;
  /** Outline colour. */
  stroke: string;
  /** Whether the marker is an outline only (commissioning). */
  outline: boolean;
  description: string;
}

export const CONDITION_STYLES: Record<AssetCondition, ConditionStyle> = {
  steady: {
    label: "Steady",
    fill: "#138a7e",
    stroke: "#0b5f57",
    outline: false,
    description: "Modal parameters within their compensated range.",
  },
  watch: {
    label: "Watch",
    fill: "#d99a16",
    stroke: "#94670a",
    outline: false,
    description: "Early warning, not confirmed.",
  },
  alert: {
    label: "Alert",
    fill: "#be1e3c",
    stroke: "#7f1028",
    outline: false,
    description: "Confirmed drift; inspection asked.",
  },
  silent: {
    label: "Silent",
    fill: "#64748b",
    stroke: "#3f4a5a",
    outline: false,
    description: "No accepted record for longer than the expected interval.",
  },
  commissioning: {
    label: "Commissioning",
    fill: "#ffffff",
    stroke: "#4f46e5",
    outline: true,
    description: "No baseline yet.",
  },
};

/** Order used by legends and filters: most urgent first. */
export const CONDITION_ORDER: readonly AssetCondition[] = ["alert", "watch", "silent", "commissioning", "steady"];

/** CSS custom properties for the root element (`--condition-<name>` and `--condition-<name>-stroke`). */
export function conditionCssVariables(): Record<string, string> {
  const vars: Record<string, string> = {};
  for (const [name, s] of Object.entries(CONDITION_STYLES)) {
    vars[`--condition-${name}`] = s.outline ? s.stroke : s.fill;
    vars[`--condition-${name}-fill`] = s.fill;
    vars[`--condition-${name}-stroke`] = s.stroke;
  }
  return vars;
}
