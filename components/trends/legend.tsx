/** A legend in the page (text, so it can be read, searched and tested), with small swatches. */
export type LegendKind = "dot" | "line" | "dash" | "cross" | "area" | "gradient";

export interface LegendItem { label: string; colour: string; kind: LegendKind }

function Swatch({ colour, kind }: { colour: string; kind: LegendKind }) {
  switch (kind) {
    case "dot":
      return <span className="inline-block h-2 w-2 rounded-full" style={{ background: colour }} />;
    case "line":
      return <span className="inline-block h-0.5 w-4" style={{ background: colour }} />;
    case "dash":
      return <span className="inline-block w-4 border-t-2 border-dashed" style={{ borderColor: colour }} />;
    case "cross":
      return <span className="inline-block text-[11px] leading-none font-bold" style={{ color: colour }}>×</span>;
    case "area":
      return <span className="inline-block h-2.5 w-4 rounded-sm border" style={{ background: colour, borderColor: colour }} />;
    case "gradient":
      return <span className="inline-block h-2 w-8 rounded-sm" style={{ background: colour }} />;
  }
}

export function Legend({ items }: { items: LegendItem[] }) {
  return (
    <ul className="flex flex-wrap items-center gap-x-3 gap-y-1 text-xs text-muted" data-testid="chart-legend">
      {items.map((i) => (
        <li key={i.label} className="flex items-center gap-1.5">
          <Swatch colour={i.colour} kind={i.kind} />
          <span>{i.label}</span>
        </li>
      ))}
    </ul>
  );
}
