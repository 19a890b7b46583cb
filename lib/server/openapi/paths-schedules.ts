import { MEMBER_CATEGORIES } from "@/lib/engine/intake";
import exampleSchedule from "@/examples/lumenbrook-depot-hall-b.json";
import { IDEMPOTENCY_LEASE_SECONDS } from "@/lib/server/http/idempotency";
import { RESULT_PAGE_DEFAULT, RESULT_PAGE_MAX, SCHEDULE_PAGE_DEFAULT, SCHEDULE_PAGE_MAX } from "@/lib/server/schedules/page-limits";
import { RESULT_DOWNLOAD_TTL_SECONDS } from "@/lib/server/schedules/result-download-link";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";

import { jsonResponse, linkHeader, pageParameters, pathParameter, problemResponse, queryParameter, type Operation } from "./operations";

const scheduleId = pathParameter("scheduleId", "The schedule's id (`sch_...`).");
const notFound = problemResponse("No such schedule (or member) in this organization; another organization's ids answer the same.");
const csvParameters = [
  queryParameter("delimiter", "CSV field separator, taken as given and never guessed.", { enum: ["comma", "semicolon", "tab"], default: "comma" }),
  queryParameter("units", "Default unit system of the CSV's bare numbers.", { enum: ["SI", "US"] }),
  queryParameter(
    "profile",
    "CSV only: the limit profile every member is checked against, e.g. `ibc-2021-floor`. ACI 318-19 profiles take their default sustained live fraction 1.0 (the conservative bound); a JSON schedule can set `profile.sustainedLiveFraction`.",
    { type: "string" },
  ),
  queryParameter("name", "CSV only: the schedule's name (default: the file name).", { type: "string", maxLength: 200 }),
  queryParameter("reference", "CSV only: a drawing or schedule reference.", { type: "string" }),
  queryParameter("callbackEndpointId", "A registered webhook endpoint (`wh_...`) to report completion to.", { type: "string" }),
];

export function buildScheduleOperations(limits: { maxMembers: number; maxBodyBytes: number; idempotencyHours: number }) {
  const bodyMb = Math.round(limits.maxBodyBytes / (1024 * 1024));
  return {
    "POST /api/v1/schedules": {
      operationId: "submitSchedule",
      tags: ["Schedules"],
      summary: "Submit a member schedule",
      description: `A whole schedule of up to ${limits.maxMembers.toLocaleString("en-US")} members and ${bodyMb} MB, as JSON (${SCHEDULE_FORMAT}), CSV (template: /api/templates/schedule.csv) or multipart/form-data with a \`file\` part. Everything is validated before anything is stored; one bad row rejects the whole schedule with its row, line and column. Checking runs in the background: poll the schedule or register a webhook. Send an Idempotency-Key to retry safely; keys expire after ${limits.idempotencyHours} hours.`,
      parameters: [
        {
          name: "Idempotency-Key",
          in: "header",
          required: false,
          description: `Repeats of a completed request with the same key return the first answer; the same key with another body is 422; while the first is still running, 409. A request that died holds its key for at most ${IDEMPOTENCY_LEASE_SECONDS} seconds, then a retry runs it. Keys are scoped to the organization and expire after ${limits.idempotencyHours} hours.`,
          schema: { type: "string", minLength: 1, maxLength: 255 },
        },
        ...csvParameters,
      ],
      requestBody: {
        required: true,
        content: {
          // The invented example schedule of examples/, so the reference page's curl line runs as shown.
          "application/json": { schema: { $ref: "#/components/schemas/Schedule" }, example: exampleSchedule },
          "text/csv": { schema: { type: "string", description: "RFC 4180 CSV, UTF-8 (a BOM is allowed), one member per row." } },
          "multipart/form-data": {
            schema: {
              type: "object",
              required: ["file"],
              properties: {
                file: { type: "string", contentMediaType: "text/csv", description: "The CSV (or a .json schedule document)." },
                delimiter: { type: "string" },
                units: { type: "string" },
                profile: { type: "string" },
                name: { type: "string" },
                reference: { type: "string" },
              },
            },
          },
        },
      },
      responses: {
        "202": jsonResponse("Accepted and queued; Location names the schedule.", "ScheduleAccepted", { Location: { schema: { type: "string" } } }),
        "409": problemResponse("The same Idempotency-Key is still in flight."),
        "413": problemResponse(`Body over ${bodyMb} MB.`),
        "415": problemResponse("Not JSON, CSV or multipart/form-data."),
        "422": problemResponse("Invalid schedule (errors[] with pointers or CSV row/line/column), or an Idempotency-Key reused with another body."),
        "503": problemResponse("The server is already reading as many schedules as its memory budget allows; nothing was stored. Send it again after Retry-After seconds."),
      },
    },
    "GET /api/v1/schedules": {
      operationId: "listSchedules",
      tags: ["Schedules"],
      summary: "List schedules",
      description: "Newest first.",
      parameters: pageParameters(SCHEDULE_PAGE_MAX, SCHEDULE_PAGE_DEFAULT),
      responses: { "200": jsonResponse("One page of schedules.", "ScheduleList", linkHeader) },
    },
    "GET /api/v1/schedules/[scheduleId]": {
      operationId: "getSchedule",
      tags: ["Schedules"],
      summary: "Read a schedule's status, progress and counts",
      parameters: [scheduleId],
      responses: { "200": jsonResponse("The schedule.", "ScheduleStatus"), "404": notFound },
    },
    "GET /api/v1/schedules/[scheduleId]/results": {
      operationId: "listResults",
      tags: ["Schedules"],
      summary: "The pass/fail table",
      description: "One row per member, sorted, filtered and keyset-paginated (a crafted or foreign-order cursor is a 400), as JSON or CSV. The CSV is streamed, rounds its figures (utilization 3 decimals, factor of safety 2, l/N whole, deflections 0.01 mm), names units in its headers and ends with the safety caution; cells that a spreadsheet would read as formulas are neutralised. Each row carries the engine's notes on the member (CSV: the notes column, joined with \"; \"), e.g. \"gross section: cracking not included\" for concrete checked with its gross I.",
      parameters: [
        scheduleId,
        queryParameter("format", "Answer format (or send Accept: text/csv).", { enum: ["json", "csv"], default: "json" }),
        queryParameter("status", "Only members with this outcome.", { enum: ["pass", "fail", "error"] }),
        queryParameter("category", "Only members of this category.", { enum: [...MEMBER_CATEGORIES] }),
        queryParameter("sort", "Order: schedule order (default), utilization (highest first, errors last), mark (case-insensitive, code-point order) or category. A cursor belongs to one order.", {
          enum: ["schedule", "utilization", "mark", "category"],
          default: "schedule",
        }),
        queryParameter("mark", "Only marks starting with this text, case-insensitively (at most 64 characters).", { type: "string", maxLength: 64 }),
        queryParameter("utilizationAbove", "Only members whose utilization is above this value, e.g. 0.9.", { type: "string", pattern: "^-?\\d+(\\.\\d+)?$" }),
        queryParameter("review", "awaiting: only members awaiting an engineer's review.", { enum: ["awaiting"] }),
        queryParameter("page", "Jump to this page (1-based; JSON only); then follow links.next and links.previous, which stay fast at any depth.", { type: "integer", minimum: 1 }),
        ...pageParameters(RESULT_PAGE_MAX, RESULT_PAGE_DEFAULT),
      ],
      responses: {
        "200": {
          description: "One page of results.",
          headers: linkHeader,
          content: { "application/json": { schema: { $ref: "#/components/schemas/ResultsPage" } }, "text/csv": { schema: { type: "string" } } },
        },
        "404": notFound,
      },
    },
    "GET /api/v1/schedules/[scheduleId]/members/[mark]": {
      operationId: "getMemberResult",
      tags: ["Schedules"],
      summary: "One member's checks in full",
      parameters: [scheduleId, pathParameter("mark", "The member's mark, URL-encoded.")],
      responses: { "200": jsonResponse("The member.", "MemberResult"), "404": notFound },
    },
    "GET /api/v1/result-downloads/[token]": {
      operationId: "downloadResults",
      tags: ["Schedules"],
      summary: "Download the full result table from a signed link",
      description: `The \`download.csv\` and \`download.ndjson\` addresses of a \`schedule.completed\` webhook: the whole result table of that one schedule, without an API key. The token names the schedule, the format and the expiry (${RESULT_DOWNLOAD_TTL_SECONDS / 86_400} days after the event) and is HMAC-signed for this one purpose; an altered token is 403, an expired one 410. CSV has the export's columns; NDJSON one results row per line.`,
      parameters: [pathParameter("token", "The signed token, exactly as the webhook gave it.")],
      responses: {
        "200": {
          description: "The full result table.",
          content: { "text/csv": { schema: { type: "string" } }, "application/x-ndjson": { schema: { type: "string", description: "One JSON object per line, each like a results-page row." } } },
        },
        "404": notFound,
      },
    },
  } satisfies Record<string, Operation>;
}
