/** Shown while the queue, its filters and their options are read. */
export default function ReviewLoading() {
  return (
    <div role="status" aria-live="polite" className="space-y-3">
      <p className="text-ink-soft">Loading the review queue…</p>
      <div aria-hidden="true" className="h-10 w-full animate-pulse rounded bg-rule" />
      <div aria-hidden="true" className="h-64 w-full animate-pulse rounded bg-rule/60" />
    </div>
  );
}
