import type { DeliveryListItem } from "@/lib/server/webhooks/list-deliveries";

import { resendDelivery } from "../actions";
import { EndpointButton } from "./endpoint-button";

function formatUtc(date: Date | null): string {
  return date ? `${date.toISOString().slice(0, 19).replace("T", " ")} UTC` : "—";
}

const statusTone = { pending: "text-ink-soft", succeeded: "text-pass", failed: "text-caution", dead: "text-fail" } as const;

export type DeliveriesTableProps = { deliveries: DeliveryListItem[] };

/** Every delivery with every attempt: status code, latency, the start of the answer, the next try. */
export function DeliveriesTable({ deliveries }: DeliveriesTableProps) {
  if (deliveries.length === 0) return <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">No deliveries match.</p>;
  return (
    <table className="w-full border-collapse text-left text-sm" aria-label="Deliveries">
      <thead className="text-xs uppercase tracking-wide text-ink-soft">
        <tr>
          <th className="pb-1 font-medium">Event</th>
          <th className="pb-1 font-medium">Endpoint</th>
          <th className="pb-1 font-medium">Status</th>
          <th className="pb-1 font-medium">Attempts</th>
          <th className="pb-1 font-medium">Next attempt</th>
          <th className="pb-1 font-medium">
            <span className="sr-only">Resend</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {deliveries.map((d) => (
          <tr key={d.id} className="border-t border-rule align-top" data-testid="delivery-row">
            <td className="py-2 pr-3">
              <code>{d.eventType}</code>
              <div className="text-xs text-ink-soft">
                <code>{d.eventId}</code> · {formatUtc(d.createdAt)}
              </div>
            </td>
            <td className="break-all py-2 pr-3 text-xs">{d.endpointUrl}</td>
            <td className={`py-2 pr-3 font-medium ${statusTone[d.status]}`}>{d.status}</td>
            <td className="py-2 pr-3">
              {d.attempts.length === 0 ? (
                <span className="text-ink-soft">none yet</span>
              ) : (
                <ol className="space-y-1">
                  {d.attempts.map((a) => (
                    <li key={a.attemptNumber} className="text-xs" data-testid="attempt">
                      #{a.attemptNumber} · {a.statusCode !== null ? `HTTP ${a.statusCode}` : "no answer"} · {a.latencyMs} ms · {formatUtc(a.createdAt)}
                      {a.error ? <div className="text-fail">{a.error}</div> : null}
                      {a.responseBody ? (
                        <details>
                          <summary className="cursor-pointer text-ink-soft">response</summary>
                          <pre className="max-w-md overflow-x-auto whitespace-pre-wrap break-all bg-paper p-1">{a.responseBody}</pre>
                        </details>
                      ) : null}
                    </li>
                  ))}
                </ol>
              )}
            </td>
            <td className="py-2 pr-3 text-xs">{d.status === "failed" || d.status === "pending" ? formatUtc(d.nextAttemptAt) : "—"}</td>
            <td className="py-2">
              <EndpointButton action={resendDelivery} label={`Resend ${d.eventType} ${d.eventId}`} fields={{ deliveryId: d.id }}>
                Resend
              </EndpointButton>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
