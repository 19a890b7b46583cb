"use client";

import { createContext, useActionState, useContext, type ReactNode } from "react";

import { Notice } from "@/components/ui/notice";
import type { ActionResult } from "@/lib/server/auth/guards";

type Action = (prev: ActionResult | null, formData: FormData) => Promise<ActionResult>;

const FieldErrorsContext = createContext<Record<string, string>>({});

/** The error message the last submission gave for a field, for use inside an ActionForm. */
export function useFieldError(name: string): string | undefined {
  return useContext(FieldErrorsContext)[name];
}

export type ActionFormProps = {
  action: Action;
  label: string;
  children: ReactNode;
  className?: string;
  showSuccess?: boolean;
};

/** A form bound to a server action, showing its outcome and each field's error. */
export function ActionForm({ action, label, children, className = "space-y-4", showSuccess = true }: ActionFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  const fieldErrors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  return (
    <form action={formAction} aria-label={label} aria-busy={pending} className={className} noValidate>
      {state && !state.ok ? <Notice tone="error">{state.message}</Notice> : null}
      {state?.ok && showSuccess ? <Notice tone="ok">{state.message}</Notice> : null}
      <FieldErrorsContext.Provider value={fieldErrors}>{children}</FieldErrorsContext.Provider>
    </form>
  );
}
