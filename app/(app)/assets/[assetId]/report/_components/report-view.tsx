import type { AssetReport } from "@/lib/reports/report-data";
import { ALERT_COLUMNS, alertRows, availabilityRows, baselineLine, FIT_COLUMNS, fitRows, MODAL_COLUMNS, modalRows } from "@/lib/reports/report-tables";
import { summariseReport } from "@/lib/reports/summary";
import { ConditionBadge } from "@/components/condition/condition-badge";
import { Table, Td, Th } from "@/components/ui/table";

export interface ReportChartImage { key: string; title: string; caption: string; src: string; width: number; height: number }

function SimpleTable({ columns, rows, testId }: { columns: readonly string[]; rows: string[][]; testId?: string }) {
  return (
    <Table className="mb-3">
      <thead>
        <tr>{columns.map((c, i) => <Th key={c} className={i > 0 ? "text-right" : undefined}>{c}</Th>)}</tr>
      </thead>
      <tbody data-testid={testId}>
        {rows.map((r, i) => (
          <tr key={i}>{r.map((c, j) => <Td key={j} className={j > 0 ? "text-right tabular-nums" : undefined}>{c}</Td>)}</tr>
        ))}
      </tbody>
    </Table>
  );
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="mb-6 break-inside-avoid-page">
      <h3 className="mb-2 text-base font-semibold tracking-tight">{title}</h3>
      {children}
    </section>
  );
}

/** The report's content, as the PDF lays it out: owners' summary, then the engineering annex. */
export function ReportView({ report, charts }: { report: AssetReport; charts: ReportChartImage[] }) {
  const s = summariseReport(report);
  const caution = (
    <p className="rounded-md border-l-4 border-amber-600 bg-amber-50 p-3 text-sm" data-testid="report-caution">
      <strong>Caution.</strong> {report.caution}
    </p>
  );
  return (
    <article className="space-y-2 print:text-[11pt]" data-testid="report">
      <section className="mb-6">
        <h2 className="mb-2 text-lg font-semibold tracking-tight">Summary for the owner</h2>
        <div className="mb-2"><ConditionBadge condition={report.asset.condition} /></div>
        <p className="mb-3 text-sm">{s.condition}</p>
        <h3 className="mb-1 text-sm font-semibold">What was found</h3>
        <ul className="mb-3 list-disc pl-5 text-sm" data-testid="report-found">{s.found.map((l) => <li key={l}>{l}</li>)}</ul>
        <h3 className="mb-1 text-sm font-semibold">What was done</h3>
        <ul className="mb-3 list-disc pl-5 text-sm" data-testid="report-done">{s.done.map((l) => <li key={l}>{l}</li>)}</ul>
        {caution}
      </section>
      <h2 className="mb-3 text-lg font-semibold tracking-tight print:break-before-page">Engineering annex</h2>
      <Section title="Tracked modes">
        {report.modes.length ? <SimpleTable columns={MODAL_COLUMNS} rows={modalRows(report)} testId="report-modes" /> : <p className="text-sm text-muted">No tracked modes.</p>}
      </Section>
      <Section title="Baseline">
        <p className="mb-2 text-sm">{baselineLine(report)}</p>
        {fitRows(report).length ? <SimpleTable columns={FIT_COLUMNS} rows={fitRows(report)} /> : null}
        {report.driftSkipped ? <p className="text-sm text-muted">Drift statistics: {report.driftSkipped}.</p> : null}
      </Section>
      <Section title="Alerts and outcomes">
        {report.alerts.length ? <SimpleTable columns={ALERT_COLUMNS} rows={alertRows(report)} testId="report-alerts" /> : <p className="text-sm text-muted">No alert was raised, open or closed in this period.</p>}
      </Section>
      <Section title="Data availability">
        <SimpleTable columns={["Measure", "Value"]} rows={availabilityRows(report)} />
      </Section>
      <section className="mb-6">
        <h3 className="mb-2 text-base font-semibold tracking-tight">Trends</h3>
        {charts.length === 0 ? <p className="text-sm text-muted">No identified frequencies in this period: nothing to draw.</p> : null}
        {charts.map((c) => (
          <figure key={c.key} className="mb-4 break-inside-avoid">
            <figcaption className="mb-1 text-sm font-medium">{c.title}</figcaption>
            {/* A server-rendered PNG as a data URL: the same image as in the PDF. */}
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src={c.src} alt={c.title} width={c.width} height={c.height} className="h-auto w-full max-w-3xl border border-line" data-testid="report-chart" />
            <p className="mt-1 text-xs text-muted">{c.caption}</p>
          </figure>
        ))}
      </section>
      <Section title="Caution">{caution}</Section>
    </article>
  );
}
