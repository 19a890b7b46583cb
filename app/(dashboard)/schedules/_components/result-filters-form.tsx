import type { ResultStatus } from "@/db/queries/schedules";
import { MEMBER_CATEGORIES } from "@/lib/engine/intake";
import { OUTCOME_LABELS } from "@/lib/vocabulary";

import { categoryLabels } from "./format";
import { RESULT_STATUSES } from "./result-filters";

export type ResultFiltersFormProps = { action: string; status?: ResultStatus; category?: string };

const selectClass = "rounded border border-rule bg-sheet px-2 py-1.5 text-sm";
const statusLabels: Record<ResultStatus, string> = OUTCOME_LABELS;

/** A plain GET form: filters live in the address, so a filtered table can be bookmarked or shared. */
export function ResultFiltersForm({ action, status, category }: ResultFiltersFormProps) {
  return (
    <form method="get" action={action} aria-label="Filter results" className="flex flex-wrap items-end gap-2">
      <label className="text-xs">
        <span className="mb-1 block font-medium uppercase tracking-wide text-ink-soft">Outcome</span>
        <select name="status" defaultValue={status ?? ""} className={selectClass}>
          <option value="">All</option>
          {RESULT_STATUSES.map((s) => (
            <option key={s} value={s}>
              {statusLabels[s]}
            </option>
          ))}
        </select>
      </label>
      <label className="text-xs">
        <span className="mb-1 block font-medium uppercase tracking-wide text-ink-soft">Category</span>
        <select name="category" defaultValue={category ?? ""} className={selectClass}>
          <option value="">All</option>
          {MEMBER_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {categoryLabels[c] ?? c}
            </option>
          ))}
        </select>
      </label>
      <button type="submit" className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper">
        Apply
      </button>
    </form>
  );
}
