import type { ReactNode } from "react";

export type NoticeProps = { tone: "ok" | "error" | "info"; children: ReactNode };

const tones = {
  ok: "border-pass/40 bg-green-50 text-pass",
  error: "border-fail/40 bg-red-50 text-fail",
  info: "border-rule bg-sheet text-ink-soft",
};

/** A form's outcome, announced politely to screen readers. */
export function Notice({ tone, children }: NoticeProps) {
  return (
    <p role={tone === "error" ? "alert" : "status"} className={`rounded border px-3 py-2 text-sm ${tones[tone]}`}>
      {children}
    </p>
  );
}
