import apiKeyCreateSchema from "@/api-schemas/v1/api-key-create.schema.json";
import apiKeyCreatedSchema from "@/api-schemas/v1/api-key-created.schema.json";
import apiKeyListSchema from "@/api-schemas/v1/api-key-list.schema.json";
import apiKeySchema from "@/api-schemas/v1/api-key.schema.json";
import dispositionCreateSchema from "@/api-schemas/v1/disposition-create.schema.json";
import dispositionSchema from "@/api-schemas/v1/disposition.schema.json";
import limitProfileWriteSchema from "@/api-schemas/v1/limit-profile-write.schema.json";
import limitProfileSchema from "@/api-schemas/v1/limit-profile.schema.json";
import materialWriteSchema from "@/api-schemas/v1/material-write.schema.json";
import materialSchema from "@/api-schemas/v1/material.schema.json";
import memberDispositionedEvent from "@/api-schemas/v1/events/member.dispositioned.schema.json";
import scheduleCompletedEvent from "@/api-schemas/v1/events/schedule.completed.schema.json";
import scheduleFailedEvent from "@/api-schemas/v1/events/schedule.failed.schema.json";
import webhookTestEvent from "@/api-schemas/v1/events/webhook.test.schema.json";
import memberResultSchema from "@/api-schemas/v1/member-result.schema.json";
import problemSchema from "@/api-schemas/v1/problem.schema.json";
import resultSchema from "@/api-schemas/v1/result.schema.json";
import resultsPageSchema from "@/api-schemas/v1/results-page.schema.json";
import reviewQueuePageSchema from "@/api-schemas/v1/review-queue-page.schema.json";
import scheduleAcceptedSchema from "@/api-schemas/v1/schedule-accepted.schema.json";
import scheduleStatusSchema from "@/api-schemas/v1/schedule-status.schema.json";
import scheduleSchema from "@/api-schemas/v1/schedule.schema.json";
import sectionCatalogueUpdateSchema from "@/api-schemas/v1/section-catalogue-update.schema.json";
import sectionCatalogueUploadSchema from "@/api-schemas/v1/section-catalogue-upload.schema.json";
import sectionCatalogueSchema from "@/api-schemas/v1/section-catalogue.schema.json";
import webhookEndpointCreateSchema from "@/api-schemas/v1/webhook-endpoint-create.schema.json";
import webhookEndpointUpdateSchema from "@/api-schemas/v1/webhook-endpoint-update.schema.json";
import webhookEndpointSchema from "@/api-schemas/v1/webhook-endpoint.schema.json";

import { embedSchema } from "./embed-schema";

/** The public contract files (api-schemas/v1) and the component name each gets. */
const contractSchemas: [string, Record<string, unknown>][] = [
  ["Schedule", scheduleSchema],
  ["Results", resultSchema],
  ["ScheduleAccepted", scheduleAcceptedSchema],
  ["ScheduleStatus", scheduleStatusSchema],
  ["ResultsPage", resultsPageSchema],
  ["MemberResult", memberResultSchema],
  ["ReviewQueuePage", reviewQueuePageSchema],
  ["DispositionCreate", dispositionCreateSchema],
  ["Disposition", dispositionSchema],
  ["Problem", problemSchema],
  ["ApiKey", apiKeySchema],
  ["ApiKeyCreate", apiKeyCreateSchema],
  ["ApiKeyCreated", apiKeyCreatedSchema],
  ["ApiKeyList", apiKeyListSchema],
  ["WebhookEndpoint", webhookEndpointSchema],
  ["WebhookEndpointCreate", webhookEndpointCreateSchema],
  ["WebhookEndpointUpdate", webhookEndpointUpdateSchema],
  ["LimitProfile", limitProfileSchema],
  ["LimitProfileWrite", limitProfileWriteSchema],
  ["Material", materialSchema],
  ["MaterialWrite", materialWriteSchema],
  ["SectionCatalogue", sectionCatalogueSchema],
  ["SectionCatalogueUpload", sectionCatalogueUploadSchema],
  ["SectionCatalogueUpdate", sectionCatalogueUpdateSchema],
  ["EventScheduleCompleted", scheduleCompletedEvent],
  ["EventScheduleFailed", scheduleFailedEvent],
  ["EventMemberDispositioned", memberDispositionedEvent],
  ["EventWebhookTest", webhookTestEvent],
];

/** Webhook events (OpenAPI 3.1 `webhooks`): event type and the component of its body. */
export const webhookEvents: [string, string][] = [
  ["schedule.completed", "EventScheduleCompleted"],
  ["schedule.failed", "EventScheduleFailed"],
  ["member.dispositioned", "EventMemberDispositioned"],
  ["webhook.test", "EventWebhookTest"],
];

const links = { type: "object", additionalProperties: { type: ["string", "null"] } };

// Envelopes around contract shapes that have no file of their own.
const answerSchemas: Record<string, Record<string, unknown>> = {
  ScheduleList: {
    type: "object",
    required: ["data"],
    properties: { data: { type: "array", items: { $ref: "#/components/schemas/ScheduleStatus" } }, links },
  },
  WebhookEndpointList: {
    type: "object",
    required: ["data"],
    properties: { data: { type: "array", items: { $ref: "#/components/schemas/WebhookEndpoint" } } },
  },
  LimitProfileList: { type: "object", required: ["data"], properties: { data: { type: "array", items: { $ref: "#/components/schemas/LimitProfile" } } } },
  MaterialList: { type: "object", required: ["data"], properties: { data: { type: "array", items: { $ref: "#/components/schemas/Material" } } } },
  SectionCatalogueList: { type: "object", required: ["data"], properties: { data: { type: "array", items: { $ref: "#/components/schemas/SectionCatalogue" } } } },
  WebhookEndpointCreated: {
    type: "object",
    required: ["endpoint", "secret"],
    properties: { endpoint: { $ref: "#/components/schemas/WebhookEndpoint" }, secret: { type: "string", pattern: "^whsec_", description: "The signing secret; store it now." } },
  },
  WebhookSecretRotated: {
    type: "object",
    required: ["secret"],
    properties: { secret: { type: "string", pattern: "^whsec_" }, previousSecretExpiresAt: { type: ["string", "null"], format: "date-time" } },
  },
  WebhookTestQueued: {
    type: "object",
    required: ["eventId", "deliveryId"],
    properties: { eventId: { type: "string" }, deliveryId: { type: "string" } },
  },
};

/** components.schemas: every contract file embedded, plus the answer shapes above. */
export function buildComponentSchemas(): Record<string, Record<string, unknown>> {
  const componentOfId = new Map(contractSchemas.map(([name, schema]) => [String(schema.$id), name]));
  const embedded = Object.fromEntries(contractSchemas.map(([name, schema]) => [name, embedSchema(schema, name, componentOfId)]));
  return { ...embedded, ...answerSchemas };
}
