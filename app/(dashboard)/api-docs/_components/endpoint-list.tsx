import type { SchemaField } from "../read-schemas";

export type EndpointParameter = { name: string; in: string; description: string; required: boolean };
export type EndpointResponse = { status: string; description: string; contentTypes: string[]; fields: SchemaField[]; example: string | null };
export type Endpoint = {
  method: string;
  path: string;
  summary: string;
  description: string;
  scope: string;
  parameters: EndpointParameter[];
  requestTypes: string[];
  requestFields: SchemaField[];
  requestExample: string | null;
  responses: EndpointResponse[];
  statuses: string[];
  /** A runnable curl line ($KEY and ids to fill in). */
  curl: string;
};
export type EndpointListProps = { tag: string; endpoints: Endpoint[] };

/** Text with `code` spans, as the OpenAPI descriptions write them. */
function renderInlineCode(text: string) {
  return text.split("`").map((part, i) => (i % 2 === 1 ? <code key={i}>{part}</code> : part));
}

function SchemaFields({ fields, label }: { fields: SchemaField[]; label: string }) {
  if (fields.length === 0) return null;
  return (
    <table className="mt-1 w-full border-collapse text-left text-xs" aria-label={label}>
      <tbody>
        {fields.map((f) => (
          <tr key={f.path} className="border-t border-rule align-top">
            <td className="py-0.5 pr-2 font-mono break-all">
              {f.path}
              {f.required ? <span className="text-ink-soft"> (required)</span> : null}
            </td>
            <td className="py-0.5 pr-2 font-mono text-ink-soft break-all">{f.type}</td>
            <td className="py-0.5 text-ink-soft">{renderInlineCode(f.description)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function CodeBlock({ text, label }: { text: string; label: string }) {
  return (
    <pre aria-label={label} className="mt-1 max-h-80 overflow-auto rounded border border-rule bg-paper p-2 text-xs">
      {text}
    </pre>
  );
}

const methodTones: Record<string, string> = {
  GET: "text-action",
  POST: "text-pass",
  PATCH: "text-caution",
  DELETE: "text-fail",
};

export function EndpointList({ tag, endpoints }: EndpointListProps) {
  return (
    <section aria-label={tag} className="space-y-3">
      <h2 className="text-base font-semibold">{tag}</h2>
      {endpoints.map((e) => (
        <article key={`${e.method} ${e.path}`} className="rounded border border-rule bg-sheet p-3" aria-label={`${e.method} ${e.path}`}>
          <h3 className="flex flex-wrap items-baseline gap-2 font-mono text-sm">
            <span className={`font-semibold ${methodTones[e.method] ?? ""}`}>{e.method}</span>
            <span className="break-all">{e.path}</span>
            <span className="ml-auto font-sans text-xs text-ink-soft">
              scope: <code>{e.scope}</code>
            </span>
          </h3>
          <p className="mt-1 font-medium">{e.summary}</p>
          {e.description ? <p className="mt-1 text-ink-soft">{renderInlineCode(e.description)}</p> : null}
          {e.parameters.length ? (
            <dl className="mt-2 grid grid-cols-[minmax(8rem,max-content)_1fr] gap-x-3 gap-y-1 text-xs">
              {e.parameters.map((p) => (
                <div key={`${p.in}:${p.name}`} className="contents">
                  <dt className="font-mono">
                    {p.name}
                    <span className="ml-1 font-sans text-ink-soft">
                      ({p.in}
                      {p.required ? ", required" : ""})
                    </span>
                  </dt>
                  <dd className="text-ink-soft">{renderInlineCode(p.description)}</dd>
                </div>
              ))}
            </dl>
          ) : null}
          <p className="mt-2 text-xs text-ink-soft">
            {e.requestTypes.length ? (
              <>
                Body: <code>{e.requestTypes.join(", ")}</code>.{" "}
              </>
            ) : null}
            Answers: {e.statuses.join(", ")}.
          </p>
          <div className="mt-2">
            <p className="text-xs font-medium">Example (curl)</p>
            <CodeBlock text={e.curl} label={`curl example for ${e.method} ${e.path}`} />
          </div>
          {e.requestFields.length || e.requestExample ? (
            <details className="mt-2 text-xs">
              <summary className="cursor-pointer font-medium">Request body schema and example</summary>
              <SchemaFields fields={e.requestFields} label={`Request body of ${e.method} ${e.path}`} />
              {e.requestExample ? <CodeBlock text={e.requestExample} label={`Request example for ${e.method} ${e.path}`} /> : null}
            </details>
          ) : null}
          <details className="mt-2 text-xs">
            <summary className="cursor-pointer font-medium">Responses</summary>
            {e.responses.map((r) => (
              <div key={r.status} className="mt-2">
                <p>
                  <span className="font-mono font-semibold">{r.status}</span> {renderInlineCode(r.description)}
                  {r.contentTypes.length ? <span className="text-ink-soft"> ({r.contentTypes.join(", ")})</span> : null}
                </p>
                {r.status.startsWith("2") ? <SchemaFields fields={r.fields} label={`Response ${r.status} of ${e.method} ${e.path}`} /> : null}
                {r.example ? <CodeBlock text={r.example} label={`Response ${r.status} example for ${e.method} ${e.path}`} /> : null}
              </div>
            ))}
          </details>
        </article>
      ))}
    </section>
  );
}
