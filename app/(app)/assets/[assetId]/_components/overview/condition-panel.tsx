import type { AssetCondition } from "@/lib/domain/types";
import { CONDITION_STYLES } from "@/components/condition/conditions";
import { ConditionDot } from "@/components/condition/condition-badge";
import { Panel } from "@/components/ui/panel";

/** The condition, why (plain words, from the drift statistics) and the caution of PRODUCT.md. */
export function ConditionPanel({
  condition, sentences, caution, note, dataIssues = [],
}: { condition: AssetCondition; sentences: string[]; caution: string; note?: string | null; dataIssues?: string[] }) {
  const s = CONDITION_STYLES[condition];
  return (
    <Panel title="Condition" bodyClassName="space-y-3">
      <div className="flex items-center gap-2" data-testid="overview-condition" data-condition={condition}>
        <ConditionDot condition={condition} size={14} />
        <span className="text-lg font-semibold">{s.label}</span>
        <span className="text-sm text-muted">— {s.description}</span>
      </div>
      <div data-testid="condition-reason" className="space-y-1 text-[15px] leading-relaxed">
        {sentences.map((t, i) => (
          <p key={i} className={i === 0 ? "font-medium" : "text-muted"}>{t}</p>
        ))}
      </div>
      {dataIssues.length > 0 ? (
        <ul className="space-y-0.5 text-sm" data-testid="condition-data-issues">
          {dataIssues.map((t) => (
            <li key={t}>
              <span className="font-medium">Data: </span>
              {t} <a href="#availability" className="text-accent hover:underline">See the channel timeline</a>.
            </li>
          ))}
        </ul>
      ) : null}
      {note ? <p className="text-sm text-muted">{note}</p> : null}
      <p
        data-testid="overview-caution"
        className="rounded-md border-l-4 px-3 py-2 text-xs leading-relaxed text-ink"
        style={{ borderLeftColor: "var(--condition-watch-stroke)", background: "#fdf8ec" }}
      >
        <strong>Caution.</strong> {caution}
      </p>
    </Panel>
  );
}
