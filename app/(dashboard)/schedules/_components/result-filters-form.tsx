import type { ResultSort } from "@/db/queries/results";
import { MEMBER_CATEGORIES } from "@/lib/engine/intake";
import type { ResultQueryFilters } from "@/db/queries/results";
import { OUTCOME_LABELS, TERMS } from "@/lib/vocabulary";

import { categoryLabels } from "./format";
import { OPTIONAL_COLUMNS, optionalColumnLabels, type OptionalColumn } from "./result-columns";

export type ResultFiltersFormProps = { action: string; sort: ResultSort; filters: ResultQueryFilters; columns: readonly OptionalColumn[] };

const fieldClass = "rounded border border-rule bg-sheet px-2 py-1.5 text-sm";
const labelClass = "mb-1 block font-medium uppercase tracking-wide text-ink-soft";
const sortLabels: Record<ResultSort, string> = { schedule: "Schedule order", utilization: "Utilization, highest first", mark: "Mark, A to Z", category: "Category" };

/** A plain GET form: filters live in the address, so a filtered table can be bookmarked or shared, and it works without script. */
export function ResultFiltersForm({ action, sort, filters, columns }: ResultFiltersFormProps) {
  return (
    <form method="get" action={action} aria-label="Filter results" className="space-y-2 print:hidden" data-testid="result-filters">
      <div className="flex flex-wrap items-end gap-2">
        <label className="text-xs">
          <span className={labelClass}>Mark starts with</span>
          <input type="search" name="mark" defaultValue={filters.markPrefix ?? ""} maxLength={64} className={`${fieldClass} w-36`} />
        </label>
        <label className="text-xs">
          <span className={labelClass}>{TERMS.outcome.label}</span>
          <select name="status" defaultValue={filters.status ?? ""} className={fieldClass}>
            <option value="">All</option>
            <option value="fail">{OUTCOME_LABELS.fail} only</option>
            <option value="error">{OUTCOME_LABELS.error} only</option>
            <option value="pass">{OUTCOME_LABELS.pass} only</option>
          </select>
        </label>
        <label className="text-xs">
          <span className={labelClass}>Category</span>
          <select name="category" defaultValue={filters.category ?? ""} className={fieldClass}>
            <option value="">All</option>
            {MEMBER_CATEGORIES.map((c) => (
              <option key={c} value={c}>
                {categoryLabels[c] ?? c}
              </option>
            ))}
          </select>
        </label>
        <label className="text-xs">
          <span className={labelClass}>Utilization above</span>
          <input type="text" inputMode="decimal" name="utilizationAbove" defaultValue={filters.utilizationAbove ?? ""} pattern="-?\d+(\.\d+)?" placeholder="e.g. 0.9" className={`${fieldClass} w-24`} />
        </label>
        <label className="flex items-center gap-1.5 pb-2 text-sm">
          <input type="checkbox" name="review" value="awaiting" defaultChecked={filters.awaitingReview === true} />
          Awaiting review
        </label>
        <label className="text-xs">
          <span className={labelClass}>Sort by</span>
          <select name="sort" defaultValue={sort} className={fieldClass}>
            {(Object.keys(sortLabels) as ResultSort[]).map((s) => (
              <option key={s} value={s}>
                {sortLabels[s]}
              </option>
            ))}
          </select>
        </label>
        <button type="submit" className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper">
          Apply
        </button>
      </div>
      <fieldset className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <legend className="float-left mr-2 text-xs font-medium uppercase tracking-wide text-ink-soft">Columns</legend>
        {/* Always sent, so clearing every box means "no optional columns" rather than "the defaults". */}
        <input type="hidden" name="cols" value="" />
        {OPTIONAL_COLUMNS.map((c) => (
          <label key={c} className="flex items-center gap-1">
            <input type="checkbox" name="col" value={c} defaultChecked={columns.includes(c)} />
            {optionalColumnLabels[c]}
          </label>
        ))}
      </fieldset>
    </form>
  );
}
