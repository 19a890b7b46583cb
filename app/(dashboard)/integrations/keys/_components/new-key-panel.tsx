"use client";

import { useState } from "react";

import { Button } from "@/components/ui/button";

export type NewKeyPanelProps = { secret: string; name: string };

/** The full key, once: it lives only in this page's memory; Sagline stores its hash. */
export function NewKeyPanel({ secret, name }: NewKeyPanelProps) {
  const [copied, setCopied] = useState<"yes" | "failed" | null>(null);
  async function copy() {
    try {
      await navigator.clipboard.writeText(secret);
      setCopied("yes");
    } catch {
      setCopied("failed");
    }
  }
  return (
    <section aria-label="New API key" className="space-y-2 rounded border border-caution/30 bg-caution-bg p-4">
      <h2 className="font-semibold text-caution">Copy the key for “{name}” now</h2>
      <p className="text-xs text-caution">
        This is the only time it is shown. Sagline keeps only a hash of it; if it is lost, revoke it and create another. Keep it out
        of URLs, code repositories and chat.
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <output aria-label="New API key value" data-testid="new-api-key" className="select-all break-all rounded border border-rule bg-sheet px-2 py-1 font-mono text-xs">
          {secret}
        </output>
        <Button tone="quiet" onClick={copy}>
          Copy
        </Button>
        <span role="status" className="text-xs text-ink-soft">
          {copied === "yes" ? "Copied." : copied === "failed" ? "Copying failed; select the key and copy it by hand." : ""}
        </span>
      </div>
    </section>
  );
}
