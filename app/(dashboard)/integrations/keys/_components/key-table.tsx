import type { ApiKeyView } from "@/lib/server/api-keys/api-key-view";

import { formatDateTime } from "../../../_components/format-date-time";
import { RevokeKeyButton } from "./revoke-key-button";

export type KeyTableProps = { keys: ApiKeyView[] };

const statusTones: Record<ApiKeyView["status"], string> = {
  active: "text-pass",
  expired: "text-caution",
  revoked: "text-fail",
};

const statusLabels: Record<ApiKeyView["status"], string> = { active: "Active", expired: "Expired", revoked: "Revoked" };

// The view carries toISOString() text, so parsing it back gives the same instant.
function formatUtcMinute(iso: string | null, empty: string): string {
  return iso ? formatDateTime(new Date(iso)) : empty;
}

function describeCreator(key: ApiKeyView): string {
  if (!key.createdBy) return "command line";
  return key.createdBy.kind === "user" ? key.createdBy.name : `key ${key.createdBy.prefix}…`;
}

export function KeyTable({ keys }: KeyTableProps) {
  if (keys.length === 0) return <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">No API keys yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left" aria-label="API keys">
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th className="pb-1 pr-3 font-medium">Key</th>
            <th className="pb-1 pr-3 font-medium">Name</th>
            <th className="pb-1 pr-3 font-medium">Scopes</th>
            <th className="pb-1 pr-3 font-medium">Created by</th>
            <th className="pb-1 pr-3 font-medium">
              Last used <span className="block normal-case tracking-normal">recorded once a minute at most</span>
            </th>
            <th className="pb-1 pr-3 font-medium">Expires</th>
            <th className="pb-1 pr-3 font-medium">Status</th>
            <th className="pb-1 font-medium">
              <span className="sr-only">Revoke</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {keys.map((key) => (
            <tr key={key.id} className="border-t border-rule align-top" data-testid={`api-key-${key.prefix}`}>
              <td className="py-2 pr-3 font-mono text-xs">{key.prefix}…</td>
              <td className="py-2 pr-3 break-words">{key.name}</td>
              <td className="py-2 pr-3">
                <ul className="space-y-0.5 text-xs">
                  {key.scopes.map((s) => (
                    <li key={s}>
                      <code>{s}</code>
                    </li>
                  ))}
                </ul>
              </td>
              <td className="py-2 pr-3 text-ink-soft">{describeCreator(key)}</td>
              <td className="py-2 pr-3 text-ink-soft">
                {formatUtcMinute(key.lastUsedAt, "never")}
              </td>
              <td className="py-2 pr-3 text-ink-soft">{formatUtcMinute(key.expiresAt, "never")}</td>
              <td className={`py-2 pr-3 font-medium ${statusTones[key.status]}`}>
                <span>{statusLabels[key.status]}</span>
                {key.revokedAt ? <span className="block text-xs font-normal text-ink-soft">{formatUtcMinute(key.revokedAt, "")}</span> : null}
              </td>
              <td className="py-2">{key.status === "revoked" ? null : <RevokeKeyButton keyId={key.id} name={key.name} prefix={key.prefix} />}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
