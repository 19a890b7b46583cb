import { formatPercent } from "./format";

export type ProgressBarProps = { checked: number; members: number; label: string };

/** A determinate progress bar with its numbers written out. */
export function ProgressBar({ checked, members, label }: ProgressBarProps) {
  const fraction = members === 0 ? 0 : checked / members;
  return (
    <div className="min-w-32">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={members}
        aria-valuenow={checked}
        aria-valuetext={`${checked} of ${members} members checked`}
        className="h-2 overflow-hidden rounded-full border border-rule bg-paper"
      >
        <div className="h-full bg-action transition-[width]" style={{ width: formatPercent(fraction) }} />
      </div>
      <p className="mt-0.5 text-xs text-ink-soft">
        {checked.toLocaleString("en-GB")} / {members.toLocaleString("en-GB")} · {formatPercent(fraction)}
      </p>
    </div>
  );
}
