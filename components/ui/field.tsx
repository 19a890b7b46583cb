import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from "react";

export type FieldProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  name: string;
  error?: string;
  /** The error's element id; unique per form when one page holds several forms with the same fields. */
  errorId?: string;
};

/** The small upper-case caption above every form control. */
function FieldLabel({ children }: { children: ReactNode }) {
  return <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">{children}</span>;
}

/** A labelled input whose error is announced and tied to it for screen readers. */
export function Field({ label, name, error, errorId: givenErrorId, className = "", ...props }: FieldProps) {
  const errorId = error ? (givenErrorId ?? `${name}-error`) : undefined;
  return (
    <label className={`block ${className}`}>
      <FieldLabel>{label}</FieldLabel>
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

export const SELECT_CLASS = "rounded border border-rule bg-sheet px-2 py-1.5 text-sm";

export type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  /** Shown under the select, inside the label. */
  hint?: ReactNode;
  error?: string;
  errorId?: string;
};

/** A labelled select with Field's caption; `className` replaces the select's own classes. */
export function SelectField({ label, hint, error, errorId: givenErrorId, className = SELECT_CLASS, children, ...props }: SelectFieldProps) {
  const errorId = error ? (givenErrorId ?? `${props.name ?? "select"}-error`) : undefined;
  return (
    <label className="block">
      <FieldLabel>{label}</FieldLabel>
      <select {...props} aria-invalid={error ? true : undefined} aria-describedby={errorId} className={`${className} aria-[invalid]:border-fail`}>
        {children}
      </select>
      {hint}
      {error ? (
        <span id={errorId} className="mt-1 block text-xs text-fail">
          {error}
        </span>
      ) : null}
    </label>
  );
}
