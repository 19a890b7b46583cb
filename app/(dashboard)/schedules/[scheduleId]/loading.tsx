/** Shown while a schedule's results load: the page's frame, so the layout does not jump. */
export default function ScheduleLoading() {
  return (
    <div aria-busy="true" aria-live="polite" className="space-y-3">
      <p className="text-sm text-ink-soft">Loading…</p>
      <div className="h-24 animate-pulse rounded border border-rule bg-sheet" />
      <div className="h-64 animate-pulse rounded border border-rule bg-sheet" />
    </div>
  );
}
