import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { getEnv } from "@/lib/env";
import { API_KEY_SCAN_PATTERN } from "@/lib/server/api-keys/key-format";
import { apiKeyScopes, scopeDescriptions } from "@/lib/server/api-keys/scopes";
import { getApiLimits, getOpenApiDocument } from "@/lib/server/openapi/build-openapi";
import { listProblemTypes } from "@/lib/server/openapi/problem-types";

import { getRateLimits } from "../../api/v1/_lib/rate-limit";
import { PageHeader } from "../_components/page-header";
import { EndpointList } from "./_components/endpoint-list";
import { readEndpointsByTag } from "./read-endpoints";

export const metadata: Metadata = { title: "API documentation" };
export const dynamic = "force-dynamic";

// Public (pageAccess "/api-docs"): partner developers read it before they have an account.
export default function ApiDocsPage() {
  const limits = getApiLimits(getRateLimits());
  const document = getOpenApiDocument({ serverUrl: getEnv().APP_URL, limits });
  const groups = readEndpointsByTag(document);
  const bodyMb = Math.round(limits.maxBodyBytes / (1024 * 1024));
  return (
    <div className="mx-auto max-w-4xl space-y-6 py-2">
      <PageHeader title="Sagline API" lead="Submit whole member schedules, read each member's serviceability result, and receive signed webhooks.">
        <a href="/api/v1/openapi.json" className="text-action underline">
          OpenAPI 3.1 document
        </a>
      </PageHeader>
      <SafetyCaution />

      <section aria-labelledby="auth-heading" className="space-y-2">
        <h2 id="auth-heading" className="text-base font-semibold">
          Authentication
        </h2>
        <p>
          Send an API key in the <code>Authorization</code> header. Integrators and administrators create keys in{" "}
          <a className="text-action underline" href="/integrations/keys">
            Integrations › API keys
          </a>
          ; each key is shown once. Keys match <code>{API_KEY_SCAN_PATTERN}</code> so secret scanners can find leaked ones. A key in a URL is
          refused; cookies are ignored; a revoked key is refused from its next request.
        </p>
        <pre className="overflow-x-auto rounded border border-rule bg-sheet p-3 text-xs">
          {`curl -H "Authorization: Bearer sgl_…" ${getEnv().APP_URL}/api/v1/schedules`}
        </pre>
        <table className="w-full border-collapse text-left text-sm" aria-label="Scopes">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 pr-3 font-medium">Scope</th>
              <th className="pb-1 font-medium">Allows</th>
            </tr>
          </thead>
          <tbody>
            {apiKeyScopes.map((s) => (
              <tr key={s} className="border-t border-rule">
                <td className="py-1 pr-3 font-mono text-xs">{s}</td>
                <td className="py-1">{scopeDescriptions[s]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section aria-labelledby="limits-heading" className="space-y-1">
        <h2 id="limits-heading" className="text-base font-semibold">
          Limits
        </h2>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            At most {limits.maxMembers.toLocaleString("en-US")} members per schedule and {bodyMb} MB per request body.
          </li>
          <li>Idempotency keys (header <code>Idempotency-Key</code>) expire after {limits.idempotencyHours} hours.</li>
          <li>
            {limits.perKeyPerMinute} requests a minute per API key and {limits.perOrganizationPerMinute} per organization; over that, 429 with{" "}
            <code>Retry-After</code>. If the rate-limit store is down, requests are let through rather than refused.
          </li>
          <li>
            CSV schedules follow the template{" "}
            <a className="text-action underline" href="/api/templates/schedule.csv">
              /api/templates/schedule.csv
            </a>
            ; pass the separator by name as <code>delimiter</code> (<code>comma</code>, <code>semicolon</code> or <code>tab</code>, as the command line takes it; never guessed)
            and the limit profile as <code>profile</code>. The names used throughout are those of the glossary (<code>docs/glossary.md</code>).
          </li>
        </ul>
      </section>

      {groups.map(([tag, endpoints]) => (
        <EndpointList key={tag} tag={tag} endpoints={endpoints} />
      ))}

      <section aria-labelledby="events-heading" className="space-y-2">
        <h2 id="events-heading" className="text-base font-semibold">
          Webhook events
        </h2>
        <p>
          Registered endpoints receive these events as signed POSTs (Standard Webhooks v1: <code>webhook-id</code>, <code>webhook-timestamp</code>,{" "}
          <code>webhook-signature</code>); the body schemas are in the OpenAPI document under <code>webhooks</code>.
        </p>
        <ul className="list-disc pl-5 font-mono text-xs">
          {Object.keys(document.webhooks).map((type) => (
            <li key={type}>{type}</li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="problems-heading" className="space-y-2">
        <h2 id="problems-heading" className="text-base font-semibold">
          Problem types
        </h2>
        <p>
          Every error is <code>application/problem+json</code> (RFC 9457) with <code>type</code>, <code>title</code>, <code>status</code> and{" "}
          <code>detail</code>; invalid input adds <code>errors[]</code> of <code>{"{ pointer, message }"}</code>. Branch on <code>type</code>.
        </p>
        <table className="w-full border-collapse text-left text-sm" aria-label="Problem types">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 pr-3 font-medium">Status</th>
              <th className="pb-1 pr-3 font-medium">Type</th>
              <th className="pb-1 font-medium">When</th>
            </tr>
          </thead>
          <tbody>
            {listProblemTypes().map((p) => (
              <tr key={p.type} className="border-t border-rule align-top">
                <td className="py-1 pr-3">{p.status}</td>
                <td className="py-1 pr-3 font-mono text-xs break-all">{p.type}</td>
                <td className="py-1">
                  <span className="font-medium">{p.title}.</span> {p.description === p.title ? null : p.description}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}
