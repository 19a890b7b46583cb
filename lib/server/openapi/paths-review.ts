import { JUSTIFICATION_MIN_CHARS } from "@/lib/server/review/disposition-input";
import { BULK_MAX_MEMBERS } from "@/lib/server/review/bulk-disposition";
import { QUEUE_MAX_LIMIT } from "@/lib/server/review/list-review-queue";
import { queueSortLabels, queueSorts } from "@/lib/server/review/queue-filters";

import { jsonResponse, linkHeader, pageParameters, pathParameter, problemResponse, queryParameter, type Operation } from "./operations";

const kinds = ["accepted_with_justification", "member_to_be_revised", "information_requested"];

export const reviewOperations = {
  "GET /api/v1/review": {
    operationId: "listReviewQueue",
    tags: ["Review"],
    summary: "The review queue",
    description: `Members that failed a check or could not be checked, across the organization's schedules, each waiting for an engineer's disposition. A member of a later submission of the same schedule reference whose inputs are unchanged shows the earlier decision as \`carriedOver\`; it is never applied, the member still waits for its own decision. Bulk dispositions (at most ${BULK_MAX_MEMBERS} members) are made in the console. Sorts: ${queueSorts.map((s) => `\`${s}\` (${queueSortLabels[s].toLowerCase()})`).join(", ")}. A cursor belongs to its sort and filters.`,
    parameters: [
      queryParameter("state", "Review state (default: awaiting_review).", { enum: ["awaiting_review", ...kinds], default: "awaiting_review" }),
      queryParameter("scheduleId", "Only this schedule (`sch_...`).", { type: "string" }),
      queryParameter("projectId", "Only this project.", { type: "string" }),
      queryParameter("category", "Only this member category, e.g. `floor_beam`.", { type: "string" }),
      queryParameter("governingCheck", "Only members governed by this check (`combinationId@spanIndex`, or `frequency`).", { type: "string" }),
      queryParameter("utilizationAbove", "Only members whose governing utilization is above this (1.0 is at the limit).", { type: "number", minimum: 0 }),
      queryParameter("sort", "Order of the queue.", { enum: [...queueSorts], default: "utilization" }),
      ...pageParameters(QUEUE_MAX_LIMIT, 50),
    ],
    responses: { "200": jsonResponse("One page of the queue.", "ReviewQueuePage", linkHeader) },
  },
  "POST /api/v1/schedules/[scheduleId]/members/[mark]/dispositions": {
    operationId: "recordDisposition",
    tags: ["Review"],
    summary: "Record a disposition on a member",
    description: `Appends a decision to the member's history (nothing is ever changed or removed), sets its review state and sends \`member.dispositioned\` to subscribed webhooks. \`accepted_with_justification\` needs a written justification of at least ${JUSTIFICATION_MIN_CHARS} characters. The key's label is recorded as who decided; only engineers and administrators can grant \`review:write\`.`,
    parameters: [pathParameter("scheduleId", "The schedule's id (`sch_...`)."), pathParameter("mark", "The member's mark, URL-encoded.")],
    requestBody: { required: true, content: { "application/json": { schema: { $ref: "#/components/schemas/DispositionCreate" } } } },
    responses: {
      "201": jsonResponse("Recorded.", "Disposition"),
      "404": problemResponse("No such schedule or member in this organization."),
      "409": problemResponse("The member passed (or is not checked yet): there is nothing to decide."),
      "413": problemResponse("Body over 64 KB."),
      "415": problemResponse("Not application/json."),
      "422": problemResponse("Invalid body; errors[] points at the field, e.g. /justification when accepting without one."),
    },
  },
} satisfies Record<string, Operation>;
