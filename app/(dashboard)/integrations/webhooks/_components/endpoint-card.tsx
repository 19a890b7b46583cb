import type { EndpointView } from "@/lib/server/webhooks/endpoints";

import { formatDateTime } from "../../../_components/format-date-time";
import { deleteEndpoint, rotateSecret, sendTestEvent, setEndpointEnabled } from "../actions";
import { EndpointButton } from "./endpoint-button";
import { EndpointForm } from "./endpoint-form";
import { RevealSecret } from "./reveal-secret";

const disabledText = {
  manual: "disabled by hand",
  gone: "disabled: the receiver answered 410 Gone",
  failing: "disabled after sustained failure",
} as const;

export type EndpointCardProps = { endpoint: EndpointView };

export function EndpointCard({ endpoint }: EndpointCardProps) {
  const status = endpoint.enabled ? "enabled" : disabledText[endpoint.disabledReason ?? "manual"];
  return (
    <li className="rounded border border-rule bg-sheet p-4" aria-label={`Endpoint ${endpoint.url}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="break-all font-medium">{endpoint.url}</p>
        <span className={endpoint.enabled ? "text-xs text-pass" : "text-xs text-fail"} data-testid="endpoint-status">
          {status}
          {endpoint.disabledAt && !endpoint.enabled ? ` · ${formatDateTime(endpoint.disabledAt)}` : ""}
        </span>
      </div>
      {endpoint.description ? <p className="text-sm text-ink-soft">{endpoint.description}</p> : null}
      <p className="mt-1 text-xs text-ink-soft">
        <code>{endpoint.id}</code> · {endpoint.eventTypes.join(", ")}
        {endpoint.rotationEndsAt ? ` · rotating: both secrets sign until ${formatDateTime(endpoint.rotationEndsAt)}` : ""}
      </p>
      <div className="mt-3 flex flex-wrap items-start gap-2">
        <EndpointButton action={sendTestEvent} label={`Send a test event to ${endpoint.url}`} fields={{ endpointId: endpoint.id }} tone="primary">
          Send test event
        </EndpointButton>
        <EndpointButton
          action={setEndpointEnabled}
          label={`${endpoint.enabled ? "Disable" : "Enable"} ${endpoint.url}`}
          fields={{ endpointId: endpoint.id, enabled: endpoint.enabled ? "false" : "true" }}
          {...(endpoint.enabled ? { confirm: { question: "Stop delivering events to this endpoint? Events while it is disabled are not sent; you can enable it again and resend them.", confirmLabel: "Yes, disable it" } } : {})}
        >
          {endpoint.enabled ? "Disable" : "Enable"}
        </EndpointButton>
        <EndpointButton
          action={rotateSecret}
          label={`Rotate the secret of ${endpoint.url}`}
          fields={{ endpointId: endpoint.id }}
          confirm={{ question: "Make a new signing secret? The old one keeps signing for a grace period; the receiver must switch to the new one before it ends.", confirmLabel: "Yes, rotate the secret" }}
        >
          Rotate secret
        </EndpointButton>
        <EndpointButton
          action={deleteEndpoint}
          label={`Delete ${endpoint.url}`}
          fields={{ endpointId: endpoint.id }}
          tone="danger"
          confirm={{ question: "Delete this endpoint and stop every delivery to it? This cannot be undone.", confirmLabel: "Yes, delete the endpoint" }}
        >
          Delete
        </EndpointButton>
        <RevealSecret endpointId={endpoint.id} url={endpoint.url} />
      </div>
      <details className="mt-3">
        <summary className="cursor-pointer text-sm text-action">Edit</summary>
        <div className="mt-2">
          <EndpointForm endpoint={endpoint} />
        </div>
      </details>
    </li>
  );
}
