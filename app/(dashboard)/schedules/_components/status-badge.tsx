import { scheduleStatusLabels } from "./format";

export type StatusBadgeProps = { status: string };

const tones: Record<string, string> = {
  completed: "border-pass/40 text-pass",
  failed: "border-fail/40 text-fail",
};

export function StatusBadge({ status }: StatusBadgeProps) {
  return (
    <span className={`inline-block whitespace-nowrap rounded border bg-sheet px-1.5 py-0.5 text-xs font-medium ${tones[status] ?? "border-rule text-ink-soft"}`}>
      {scheduleStatusLabels[status] ?? status}
    </span>
  );
}
