export type EndpointParameter = { name: string; in: string; description: string; required: boolean };
export type Endpoint = {
  method: string;
  path: string;
  summary: string;
  description: string;
  scope: string;
  parameters: EndpointParameter[];
  requestTypes: string[];
  statuses: string[];
};
export type EndpointListProps = { tag: string; endpoints: Endpoint[] };

/** Text with `code` spans, as the OpenAPI descriptions write them. */
function renderInlineCode(text: string) {
  return text.split("`").map((part, i) => (i % 2 === 1 ? <code key={i}>{part}</code> : part));
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
        </article>
      ))}
    </section>
  );
}
