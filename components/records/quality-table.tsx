import { Table, Td, Th } from "@/components/ui/table";
import type { ChannelQualityView } from "./types";

const FLAG_LABELS: Record<string, string> = {
  non_finite: "Non-finite samples",
  gap: "Gap",
  clipping: "Clipping",
  flat_line: "Flat line",
  spikes: "Spikes",
  mains_hum: "Mains hum",
  rms_out_of_history: "RMS out of its usual range",
};

/** Flags that make the screening leave a channel out (lib/signal/quality.ts). */
const EXCLUDING = new Set(["non_finite", "gap", "clipping", "flat_line"]);

/** The data-quality screening per channel: flags, RMS and the screening's own notes. */
export function QualityTable({ channels, units }: { channels: ChannelQualityView[]; units: string }) {
  return (
    <Table>
      <thead>
        <tr>
          <Th>Channel</Th>
          <Th>Flags</Th>
          <Th className="text-right">RMS ({units})</Th>
          <Th>Notes</Th>
        </tr>
      </thead>
      <tbody>
        {channels.map((c) => (
          <tr key={c.channel} data-quality-channel={c.channel} data-flags={c.flags.join(" ")}>
            <Td className="font-mono text-xs">{c.channel}</Td>
            <Td>
              {c.flags.length === 0 ? (
                <span className="text-sm text-[var(--condition-steady-stroke)]">Clean</span>
              ) : (
                <span className="flex flex-wrap gap-1">
                  {c.flags.map((f) => (
                    <span
                      key={f}
                      className="rounded border px-1.5 py-0.5 text-xs"
                      style={{
                        borderColor: `var(--condition-${EXCLUDING.has(f) ? "alert" : "watch"}-stroke)`,
                        color: `var(--condition-${EXCLUDING.has(f) ? "alert" : "watch"}-stroke)`,
                      }}
                    >
                      {FLAG_LABELS[f] ?? f}
                    </span>
                  ))}
                </span>
              )}
            </Td>
            <Td className="text-right tabular-nums">{Number.isFinite(c.rms) ? c.rms.toExponential(2) : "—"}</Td>
            <Td className="text-xs text-muted">{c.notes.join("; ") || "—"}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
