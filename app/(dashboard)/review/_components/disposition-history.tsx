import { CARRIED_OVER_LABEL, dispositionKindLabels } from "@/lib/review-vocabulary";
import type { HistoryEntry } from "@/lib/server/review/get-member-review";

export type DispositionHistoryProps = { history: HistoryEntry[] };

/** Who decided what, when and why, newest first; an entry from an earlier submission says so and is not this member's state. */
export function DispositionHistory({ history }: DispositionHistoryProps) {
  if (history.length === 0) return <p className="mt-2 text-sm text-ink-soft">No disposition recorded yet.</p>;
  return (
    <ol aria-label="Disposition history" className="mt-2 space-y-2 text-sm">
      {history.map((entry) => (
        <li key={`${entry.id}:${entry.carriedOver}`} className={`border-l-2 pl-2 ${entry.carriedOver ? "border-dashed border-rule text-ink-soft" : "border-action"}`}>
          {entry.carriedOver ? <strong className="block text-xs font-semibold uppercase tracking-wide">{CARRIED_OVER_LABEL} from an earlier submission (not applied)</strong> : null}
          <span className="font-medium">{dispositionKindLabels[entry.kind]}</span> · {entry.decidedByName} · {entry.decidedAt.slice(0, 16).replace("T", " ")} UTC
          {entry.bulkId ? <span className="text-xs text-ink-soft"> · bulk {entry.bulkId}</span> : null}
          {entry.justification ? <p className="mt-0.5 whitespace-pre-wrap [overflow-wrap:anywhere]">{entry.justification}</p> : null}
        </li>
      ))}
    </ol>
  );
}
