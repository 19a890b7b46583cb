/** Shown while the member's page is read and its diagrams are computed. */
export default function MemberLoading() {
  return (
    <div role="status" aria-live="polite" className="space-y-3">
      <p className="text-ink-soft">Loading the member and its diagrams…</p>
      <div aria-hidden="true" className="h-6 w-64 animate-pulse rounded bg-rule" />
      <div aria-hidden="true" className="h-40 w-full animate-pulse rounded bg-rule/60" />
    </div>
  );
}
