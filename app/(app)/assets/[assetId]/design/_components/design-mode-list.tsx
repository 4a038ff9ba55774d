"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Table, Td, Th } from "@/components/ui/table";
import { DeleteDesignModeButton, DesignModeForm } from "./design-mode-form";
import type { DesignModeJson } from "./types";

/** The asset's design modes; engineers edit a row in place or remove it. */
export function DesignModeList({ assetId, modes, channels, trackedOptions, canEdit }: {
  assetId: string; modes: DesignModeJson[]; channels: string[]; trackedOptions: { value: string; label: string }[]; canEdit: boolean;
}) {
  const [editing, setEditing] = useState<string | null>(null);
  const tracked = new Map(trackedOptions.map((o) => [o.value, o.label]));
  if (modes.length === 0) return <p className="p-3 text-sm text-muted">No design modes yet.</p>;
  return (
    <Table>
      <thead><tr><Th>Label</Th><Th>Frequency</Th><Th>Direction</Th><Th>Linked tracked mode</Th><Th>Shape</Th><Th>Source</Th>{canEdit ? <Th /> : null}</tr></thead>
      <tbody>
        {modes.map((m) => editing === m.id ? (
          <tr key={m.id}><Td colSpan={7}><DesignModeForm assetId={assetId} channels={channels} trackedOptions={trackedOptions} mode={m} onDone={() => setEditing(null)} /></Td></tr>
        ) : (
          <tr key={m.id} data-testid="design-mode-row">
            <Td>{m.label}</Td><Td>{m.frequencyHz.toFixed(3)} Hz</Td><Td>{m.direction ?? "—"}</Td>
            <Td>{m.trackedModeId ? tracked.get(m.trackedModeId) ?? "inactive mode" : <span className="text-faint">nearest frequency</span>}</Td>
            <Td>{m.shape ? `${Object.keys(m.shape).length} channels` : "—"}</Td><Td className="text-xs text-muted">{m.sourceNote ?? "—"}</Td>
            {canEdit ? (
              <Td className="whitespace-nowrap">
                <Button size="sm" variant="quiet" onClick={() => setEditing(m.id)}>Edit</Button>{" "}
                <DeleteDesignModeButton assetId={assetId} designModeId={m.id} />
              </Td>
            ) : null}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
