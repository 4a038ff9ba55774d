import type { AnalysisSettingsValues } from "@/lib/domain/records";
import { formatDateTime } from "@/components/ui/format";
import { Table, Td, Th } from "@/components/ui/table";
import { describeSettings } from "../_lib/views";

/** The current settings, read-only (owners, inspectors). */
export function SettingsSummary({ settings }: { settings: AnalysisSettingsValues }) {
  return (
    <dl className="grid grid-cols-2 gap-4 sm:grid-cols-3 lg:grid-cols-5" data-testid="settings-summary">
      {describeSettings(settings).map((s) => (
        <div key={s.label} className="min-w-0">
          <dt className="text-xs uppercase tracking-wide text-muted">{s.label}</dt>
          <dd className="mt-0.5 text-sm tabular-nums">{s.value}</dd>
        </div>
      ))}
    </dl>
  );
}

interface VersionView { version: number; createdByName: string | null; createdAt: Date; settings: AnalysisSettingsValues }

/** Earlier settings versions, newest first: results analysed with them keep them. */
export function SettingsHistory({ versions, timeZone }: { versions: VersionView[]; timeZone: string }) {
  if (versions.length === 0) return <p className="mt-4 text-xs text-faint">No earlier versions.</p>;
  return (
    <details className="mt-5" data-testid="settings-history">
      <summary className="cursor-pointer text-sm font-medium">Earlier versions ({versions.length})</summary>
      <Table className="mt-2">
        <thead>
          <tr><Th>Version</Th><Th>Saved by</Th><Th>When</Th><Th>Settings</Th></tr>
        </thead>
        <tbody>
          {versions.map((v) => (
            <tr key={v.version} data-settings-version={v.version}>
              <Td className="tabular-nums">v{v.version}</Td>
              <Td>{v.createdByName ?? <span className="text-muted">defaults</span>}</Td>
              <Td className="whitespace-nowrap">{formatDateTime(v.createdAt, timeZone)}</Td>
              <Td className="text-xs text-muted">{describeSettings(v.settings).map((s) => `${s.label}: ${s.value}`).join(" · ")}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </details>
  );
}
