import Link from "next/link";

import { SelectField } from "@/components/ui/field";
import { queueSortLabels, reviewStateLabels, reviewStateOrder } from "@/lib/review-vocabulary";
import type { QueueOptions } from "@/lib/server/review/list-queue-options";
import type { QueueQuery } from "@/lib/server/review/queue-filters";

import { categoryLabels, formatCheckKey } from "../../schedules/_components/format";

export type QueueFiltersFormProps = { query: QueueQuery; options: QueueOptions };

/** A plain GET form: the selection lives in the address, so it can be bookmarked and shared. */
export function QueueFiltersForm({ query, options }: QueueFiltersFormProps) {
  return (
    <form method="get" action="/review" aria-label="Filter the review queue" className="flex flex-wrap items-end gap-3 rounded border border-rule bg-sheet p-3">
      <SelectField label="State" name="state" defaultValue={query.state}>
        {reviewStateOrder.map((s) => (
          <option key={s} value={s}>
            {reviewStateLabels[s]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Schedule" name="scheduleId" defaultValue={query.scheduleId ?? ""}>
        <option value="">Any schedule</option>
        {options.schedules.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Project" name="projectId" defaultValue={query.projectId ?? ""}>
        <option value="">Any project</option>
        {options.projects.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Category" name="category" defaultValue={query.category ?? ""}>
        <option value="">Any category</option>
        {options.categories.map((c) => (
          <option key={c} value={c}>
            {categoryLabels[c] ?? c}
          </option>
        ))}
      </SelectField>
      <SelectField label="Governing check" name="governingCheck" defaultValue={query.governingCheck ?? ""}>
        <option value="">Any check</option>
        {options.governingChecks.map((c) => (
          <option key={c} value={c}>
            {formatCheckKey(c)}
          </option>
        ))}
      </SelectField>
      <label className="block">
        <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">Utilization above</span>
        <input name="utilizationAbove" type="number" min={0} step="0.01" defaultValue={query.utilizationAbove ?? ""} placeholder="e.g. 1.2" className="w-24 rounded border border-rule bg-sheet px-2 py-1.5 text-sm" />
      </label>
      <SelectField label="Sort" name="sort" defaultValue={query.sort}>
        {Object.entries(queueSortLabels).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <button type="submit" className="rounded border border-action bg-action px-3 py-1.5 text-sm font-medium text-white hover:bg-action-strong">
        Apply filters
      </button>
      <Link href="/review" className="py-1.5 text-sm text-action underline">
        Clear
      </Link>
    </form>
  );
}
