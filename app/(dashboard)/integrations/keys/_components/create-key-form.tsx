"use client";

import { useActionState } from "react";

import { SubmitButton } from "@/components/forms/submit-button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { ApiKeyScope } from "@/db/schema";

import { createApiKey } from "../actions";
import { scopeFieldName } from "../scope-fields";
import { NewKeyPanel } from "./new-key-panel";

export type ScopeOption = { scope: ApiKeyScope; description: string; admin: boolean };
export type CreateKeyFormProps = { scopes: ScopeOption[]; maxExpiresDays: number; maxNameLength: number };

/** Like ActionForm, but keeps the action's data: the new key, shown once, only in this browser tab. */
export function CreateKeyForm({ scopes, maxExpiresDays, maxNameLength }: CreateKeyFormProps) {
  const [state, formAction, pending] = useActionState(createApiKey, null);
  const fieldErrors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const created = state?.ok ? state.data : undefined;
  const scopesError = fieldErrors.scopes;
  return (
    <div className="space-y-4">
      {created ? <NewKeyPanel secret={created.secret} name={created.name} /> : null}
      <form action={formAction} aria-label="Create an API key" aria-busy={pending} className="space-y-3 rounded border border-rule bg-sheet p-4" noValidate>
        <h2 className="font-semibold">Create an API key</h2>
        {state && !state.ok ? <Notice tone="error">{state.message}</Notice> : null}
        <Field label="Name" name="name" maxLength={maxNameLength} autoComplete="off" placeholder="e.g. Ostrovel shop-drawing export" error={fieldErrors.name} />
        <fieldset aria-describedby={scopesError ? "scopes-error" : undefined}>
          <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Scopes</legend>
          <ul className="space-y-1">
            {scopes.map((s) => (
              <li key={s.scope}>
                <label className="flex items-start gap-2">
                  <input type="checkbox" name={scopeFieldName(s.scope)} defaultChecked={!s.admin} className="mt-0.5" />
                  <span>
                    <code className="text-xs">{s.scope}</code>
                    {s.admin ? <span className="ml-1 text-xs text-caution">administrative</span> : null}
                    <span className="block text-xs text-ink-soft">{s.description}</span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
          {scopesError ? (
            <span id="scopes-error" className="mt-1 block text-xs text-fail">
              {scopesError}
            </span>
          ) : null}
        </fieldset>
        <Field
          label="Expires after (days, optional)"
          name="expiresInDays"
          inputMode="numeric"
          pattern="[0-9]*"
          placeholder={`1 to ${maxExpiresDays}; empty for no expiry`}
          error={fieldErrors.expiresInDays}
        />
        <SubmitButton pendingLabel="Creating…">Create key</SubmitButton>
      </form>
    </div>
  );
}
