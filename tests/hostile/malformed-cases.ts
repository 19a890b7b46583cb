/**
 * Malformed requests generated from the served OpenAPI document: for each secured operation,
 * bad credentials; for each path parameter, hostile ids; for each JSON body, bad JSON, wrong
 * types, deep nesting, unknown fields, an oversize body and wrong content types; for each
 * cursor, crafted cursors. Path parameters are filled with ids of the right shape that do not
 * exist, so every case must end in a 4xx.
 */
export interface OpenApiDocument {
  paths: Record<string, Record<string, OpenApiOperation>>;
}

interface OpenApiOperation {
  parameters?: { name: string; in: string }[];
  requestBody?: { content: Record<string, unknown> };
  security?: unknown[];
}

export interface Operation {
  method: string;
  path: string;
  pathParams: string[];
  queryParams: string[];
  bodyTypes: string[];
}

export interface MalformedCase {
  label: string;
  method: "get" | "post" | "patch" | "delete" | "put";
  path: string;
  headers?: Record<string, string>;
  body?: string | Buffer;
}

const METHODS = new Set(["get", "post", "patch", "delete", "put"]);

/** Every secured operation (the public document itself answers anything). */
export function listOperations(doc: OpenApiDocument): Operation[] {
  return Object.entries(doc.paths).flatMap(([path, ops]) =>
    Object.entries(ops)
      .filter(([method, op]) => METHODS.has(method) && (op.security?.length ?? 0) > 0)
      .map(([method, op]) => ({
        method: method.toUpperCase(),
        path,
        pathParams: (op.parameters ?? []).filter((p) => p.in === "path").map((p) => p.name),
        queryParams: (op.parameters ?? []).filter((p) => p.in === "query").map((p) => p.name),
        bodyTypes: Object.keys(op.requestBody?.content ?? {}),
      })),
  );
}

// Well-formed ids that exist nowhere.
const MISSING_IDS: Record<string, string> = { scheduleId: "sch_zzzzzzzzzzzzzzzz", keyId: "key_zzzzzzzzzzzzzzzz", endpointId: "wh_zzzzzzzzzzzzzzzz", mark: "NO-SUCH-MARK" };

const HOSTILE_IDS: [string, string][] = [
  ["SQL in an id", "%27%20or%201%3D1--"],
  ["a NUL in an id", "sch_%00"],
  ["a 5,000-character id", "x".repeat(5000)],
  ["a script tag as an id", "%3Cscript%3Ealert(1)%3C%2Fscript%3E"],
  ["an encoded path traversal", "..%2F..%2Fetc%2Fpasswd"],
  ["bad percent-encoding", "%E0%A4%A"],
];

const crafted = (value: unknown) => Buffer.from(JSON.stringify(value)).toString("base64url");
const BAD_CURSORS: [string, string][] = [
  ["a cursor that is not base64 JSON", "not-a-cursor"],
  ["a cursor with SQL", encodeURIComponent("'; drop table schedules;--")],
  ["a cursor 10,000 characters long", "A".repeat(10_000)],
  ["a cursor with a year PostgreSQL cannot hold", crafted({ createdAt: "+275760-09-13T00:00:00.000Z", id: "sch_a", c: "+275760-09-13T00:00:00.000Z", i: "key_a", after: 1 })],
  ["a cursor with a time that is a bare number", crafted({ createdAt: "1", id: "sch_a", c: "1", i: "key_a", after: "1" })],
  ["a cursor with an index out of range", crafted({ after: 1e300 })],
  ["a cursor that is a JSON array", crafted([1, 2, 3])],
];

function fillPath(path: string, values: Record<string, string>): string {
  return path.replace(/\{([^}]+)\}/g, (_, name: string) => values[name] ?? MISSING_IDS[name] ?? "zzzz");
}

function jsonBodyCases(): { label: string; type?: string; body: string | Buffer }[] {
  // Under the 64 KB cap of the small JSON routes, so it is parsed and checked, not refused for size.
  const deep = 30_000;
  return [
    { label: "truncated JSON", type: "application/json", body: '{"name":' },
    { label: "JSON with a trailing comma", type: "application/json", body: '{"name":"a",}' },
    { label: "a JSON array", type: "application/json", body: "[]" },
    { label: "a JSON string", type: "application/json", body: '"text"' },
    { label: "JSON null", type: "application/json", body: "null" },
    { label: "wrong types everywhere", type: "application/json", body: JSON.stringify({ name: 5, url: ["x"], scopes: "all", eventTypes: {}, enabled: "yes", members: "many", format: 1 }) },
    { label: "unknown fields and prototype keys", type: "application/json", body: '{"colour":"red","__proto__":{"admin":true},"constructor":{"prototype":{"admin":true}}}' },
    { label: "deep nesting", type: "application/json", body: `{"name":${"[".repeat(deep)}${"]".repeat(deep)}}` },
    { label: "invalid UTF-8", type: "application/json", body: Buffer.from([0x7b, 0x22, 0xff, 0xfe, 0x22, 0x7d]) },
    { label: "a huge number", type: "application/json", body: '{"expiresInDays":1e999,"name":"x"}' },
    { label: "a 100 KB body", type: "application/json", body: JSON.stringify({ name: "x".repeat(100 * 1024) }) },
    { label: "no content type", body: "{}" },
    { label: "text/plain", type: "text/plain", body: "{}" },
    { label: "application/xml", type: "application/xml", body: "<a/>" },
    { label: "a content type with a hostile parameter", type: `application/json; charset=${"x".repeat(5000)}`, body: "{" },
    { label: "a PNG sent as CSV", type: "text/csv", body: Buffer.from("89504e470d0a1a0a0000000d49484452", "hex") },
    { label: "a UTF-16 file sent as CSV", type: "text/csv", body: Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from("mark,category\r\nA,floor_beam\r\n", "utf16le")]) },
    { label: "a zip file sent as multipart", type: "multipart/form-data; boundary=b", body: Buffer.concat([Buffer.from('--b\r\nContent-Disposition: form-data; name="file"; filename="s.csv"\r\nContent-Type: text/csv\r\n\r\n'), Buffer.from("504b0304140000000800", "hex"), Buffer.from("\r\n--b--\r\n")]) },
  ];
}

/** The cases for one operation. */
export function buildOperationCases(operation: Operation): MalformedCase[] {
  const method = operation.method.toLowerCase() as MalformedCase["method"];
  const path = fillPath(operation.path, {});
  const cases: MalformedCase[] = [
    { label: "a garbage bearer token", method, path, headers: { authorization: "Bearer sgl_live_!!!!'\"<>garbage" } },
    { label: "a 10,000-character bearer token", method, path, headers: { authorization: `Bearer ${"k".repeat(10_000)}` } },
    { label: "Basic credentials instead of a bearer key", method, path, headers: { authorization: "Basic YWRtaW46YWRtaW4=" } },
  ];
  for (const name of operation.pathParams) {
    for (const [label, value] of HOSTILE_IDS) cases.push({ label: `${label} (${name})`, method, path: fillPath(operation.path, { [name]: value }) });
  }
  if (operation.queryParams.includes("cursor")) {
    for (const [label, cursor] of BAD_CURSORS) cases.push({ label, method, path: `${path}?cursor=${cursor}` });
    cases.push({ label: "a limit that is not a number", method, path: `${path}?limit=1e9999` });
  }
  if (operation.bodyTypes.length > 0) {
    // CSV parameters, so a CSV body is read rather than refused for a missing preset.
    const withQuery = operation.bodyTypes.includes("text/csv") ? `${path}?profile=ibc-2021-floor` : path;
    for (const c of jsonBodyCases()) cases.push({ label: c.label, method, path: withQuery, headers: c.type ? { "content-type": c.type } : {}, body: c.body });
  }
  return cases;
}
