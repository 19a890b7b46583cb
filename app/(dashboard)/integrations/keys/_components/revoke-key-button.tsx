"use client";

import { ActionForm } from "@/components/forms/action-form";
import { SubmitButton } from "@/components/forms/submit-button";

import { revokeApiKey } from "../actions";

export type RevokeKeyButtonProps = { keyId: string; name: string; prefix: string };

/** Two steps, working without script too: open the confirmation, then confirm. */
export function RevokeKeyButton({ keyId, name, prefix }: RevokeKeyButtonProps) {
  return (
    <details className="group">
      <summary className="inline-block cursor-pointer list-none rounded border border-fail/40 bg-sheet px-2 py-1 text-xs font-medium text-fail hover:bg-red-50" aria-label={`Revoke ${name}`}>
        Revoke…
      </summary>
      <ActionForm action={revokeApiKey} label={`Confirm revoking ${name}`} className="mt-2 w-44 space-y-2 rounded border border-rule bg-sheet p-2">
        <input type="hidden" name="keyId" value={keyId} />
        <p className="text-xs">
          Revoke <strong>{name}</strong> (<code>{prefix}…</code>)? Systems using it are refused from their next request. This cannot be undone.
        </p>
        <SubmitButton tone="danger" pendingLabel="Revoking…">
          Yes, revoke this key
        </SubmitButton>
      </ActionForm>
    </details>
  );
}
