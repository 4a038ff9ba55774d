"use client";

import { Fragment, type ReactNode } from "react";
import { cx } from "@/components/ui/cx";
import { Table, Td, Th } from "@/components/ui/table";
import { formatDamping, formatHz, formatRatio, formatSigned } from "./format";
import type { ModeView } from "./types";

/** Below this MPC a shape is far from real (mixed or noisy) [practice]. */
const LOW_MPC = 0.8;

export function modeFlags(m: ModeView): string[] {
  const flags: string[] = [];
  if (!m.dampingReliable) flags.push("Damping unreliable");
  if (m.possiblyCoupled) flags.push("Possibly coupled");
  if (m.mpc < LOW_MPC) flags.push("Complex shape");
  if (m.fddPeakHz === null && m.ssi) flags.push("SSI-COV only");
  if (m.reliability && m.reliability.bandwidthLines !== null && m.reliability.bandwidthLines < 3) flags.push("Few lines in bandwidth");
  return flags;
}

function Sub({ children }: { children: ReactNode }) {
  return <div className="text-[11px] text-faint">{children}</div>;
}

/**
 * The modal table: frequency, damping by EFDD and by half-power (with Q and loss factor),
 * SSI-COV values, the tracked mode it was assigned to with MAC, MPC and reliability flags.
 * A row is selectable (drives the shape view); `renderAction`/`renderExpanded` add controls.
 */
export function ModalTable({
  modes, selected, onSelect, renderAction, renderExpanded,
}: {
  modes: ModeView[];
  selected: number | null;
  onSelect: (modeIndex: number) => void;
  renderAction?: (m: ModeView) => ReactNode;
  renderExpanded?: (m: ModeView) => ReactNode;
}) {
  const cols = renderAction ? 10 : 9;
  return (
    <Table>
      <thead>
        <tr>
          <Th>#</Th>
          <Th className="text-right">Frequency</Th>
          <Th className="text-right">ζ EFDD</Th>
          <Th className="text-right">ζ half-power</Th>
          <Th className="text-right">SSI-COV</Th>
          <Th>Tracked mode</Th>
          <Th className="text-right">MAC</Th>
          <Th className="text-right">MPC</Th>
          <Th>Flags</Th>
          {renderAction ? <Th><span className="sr-only">Actions</span></Th> : null}
        </tr>
      </thead>
      <tbody>
        {modes.map((m) => {
          const flags = modeFlags(m);
          const expanded = renderExpanded?.(m);
          return (
            <Fragment key={m.modeIndex}>
              <tr
                data-mode-row={m.modeIndex}
                aria-selected={m.modeIndex === selected}
                onClick={() => onSelect(m.modeIndex)}
                className={cx("cursor-pointer", m.modeIndex === selected ? "bg-accent-soft/70" : "hover:bg-sunken/60")}
              >
                <Td className="tabular-nums text-muted">{m.modeIndex + 1}</Td>
                <Td className="text-right tabular-nums font-medium">
                  {formatHz(m.frequencyHz)}
                  {m.fddPeakHz !== null ? <Sub>peak {formatHz(m.fddPeakHz)}</Sub> : null}
                </Td>
                <Td className="text-right tabular-nums">{formatDamping(m.efdd?.dampingRatio)}</Td>
                <Td className="text-right tabular-nums">
                  {formatDamping(m.halfPower?.dampingRatio)}
                  {m.halfPower ? <Sub>Q {m.halfPower.q.toFixed(0)} · η {m.halfPower.lossFactor.toFixed(4)}</Sub> : null}
                </Td>
                <Td className="text-right tabular-nums">
                  {m.ssi ? (
                    <>
                      {formatHz(m.ssi.frequencyHz)}
                      <Sub>ζ {formatDamping(m.ssi.dampingRatio)} · MAC {m.ssi.mac.toFixed(2)}</Sub>
                    </>
                  ) : "—"}
                </Td>
                <Td>
                  {m.tracked ? (
                    <>
                      <span className="font-medium" data-tracked-label>{m.tracked.label}</span>
                      <Sub>Δf {formatSigned(m.tracked.frequencyDeviation)}</Sub>
                    </>
                  ) : <span className="text-faint">Unassigned</span>}
                </Td>
                <Td className="text-right tabular-nums">{formatRatio(m.tracked?.mac ?? null)}</Td>
                <Td className="text-right tabular-nums">{formatRatio(m.mpc)}</Td>
                <Td>
                  {flags.length ? (
                    <span className="flex flex-wrap gap-1">
                      {flags.map((f) => (
                        <span key={f} className="rounded border border-[var(--condition-watch-stroke)] px-1.5 py-0.5 text-[11px] text-[var(--condition-watch-stroke)]">{f}</span>
                      ))}
                    </span>
                  ) : <span className="text-xs text-faint">—</span>}
                </Td>
                {renderAction ? <Td className="text-right" onClick={(e) => e.stopPropagation()}>{renderAction(m)}</Td> : null}
              </tr>
              {expanded ? (
                <tr>
                  <td colSpan={cols} className="border-b border-line bg-sunken/50 px-3 py-3">{expanded}</td>
                </tr>
              ) : null}
            </Fragment>
          );
        })}
        {modes.length === 0 ? (
          <tr><Td colSpan={cols} className="py-6 text-center text-muted">No modes were identified in this record.</Td></tr>
        ) : null}
      </tbody>
    </Table>
  );
}
