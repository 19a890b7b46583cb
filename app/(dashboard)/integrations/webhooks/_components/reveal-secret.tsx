"use client";

import { useActionState } from "react";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

import { revealSecret } from "../actions";

export type RevealSecretProps = { endpointId: string; url: string };

/** Shows the signing secret only when asked, and only to whoever may manage integrations. */
export function RevealSecret({ endpointId, url }: RevealSecretProps) {
  const [state, action, pending] = useActionState(revealSecret, null);
  return (
    <form action={action} aria-label={`Signing secret of ${url}`} className="space-y-1">
      <input type="hidden" name="endpointId" value={endpointId} />
      <Button type="submit" tone="quiet" disabled={pending}>
        {state?.ok ? "Reveal again" : "Reveal secret"}
      </Button>
      {state && !state.ok ? <Notice tone="error">{state.message}</Notice> : null}
      {state?.ok && state.data ? (
        <div className="rounded border border-rule bg-paper p-2 text-xs">
          <p>
            Signing secret: <code data-testid="signing-secret" className="break-all">{state.data.secret}</code>
          </p>
          {state.data.previousSecret ? (
            <p className="mt-1 text-ink-soft">
              Previous secret (still signing during the rotation): <code className="break-all">{state.data.previousSecret}</code>
            </p>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
