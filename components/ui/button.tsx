import type { ButtonHTMLAttributes } from "react";

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & { tone?: "primary" | "quiet" | "danger" };

const tones = {
  primary: "bg-action text-white hover:bg-action-strong border-action",
  quiet: "bg-sheet text-ink hover:bg-paper border-rule",
  danger: "bg-sheet text-fail hover:bg-red-50 border-fail/40",
};

export function Button({ tone = "primary", className = "", type = "button", ...props }: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center gap-1 rounded border px-3 py-1.5 text-sm font-medium disabled:opacity-60 ${tones[tone]} ${className}`}
      {...props}
    />
  );
}
