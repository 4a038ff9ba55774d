import type { ReactNode } from "react";
import { Legend, type LegendItem } from "./legend";

/** One chart with its title, HTML legend, CSV link and an optional note under it. */
export function ChartCard({
  title, legend, csvHref, note, testId, children, className,
}: {
  title: string;
  legend: LegendItem[];
  csvHref: string;
  note?: ReactNode;
  testId: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <figure className={`min-w-0 rounded-md border border-line bg-surface p-3 ${className ?? ""}`} data-testid={testId}>
      <figcaption className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-sm font-medium">{title}</span>
        <a href={csvHref} className="text-xs font-medium text-accent hover:underline" download data-testid="csv-link">
          CSV
        </a>
      </figcaption>
      <Legend items={legend} />
      <div className="mt-2 h-64 w-full">{children}</div>
      {note ? <p className="mt-2 text-xs text-muted">{note}</p> : null}
    </figure>
  );
}
