import type { InputHTMLAttributes } from "react";

export type FieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string };

/** A labelled input whose error is announced and tied to it for screen readers. */
export function Field({ label, name, error, className = "", ...props }: FieldProps) {
  const errorId = error ? `${name}-error` : undefined;
  return (
    <label className={`block ${className}`}>
      <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">{label}</span>
      <input
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={errorId}
        className="w-full rounded border border-rule bg-sheet px-2 py-1.5 text-sm aria-[invalid]:border-fail"
        {...props}
      />
      {error ? (
        <span id={errorId} className="mt-1 block text-xs text-fail">
          {error}
        </span>
      ) : null}
    </label>
  );
}
