import { jsonResponse, pathParameter, problemResponse, type Operation } from "./operations";

const endpointId = pathParameter("endpointId", "The endpoint's id (`wh_...`).");
const notFound = problemResponse("No such endpoint in this organization.");
const body = (component: string) => ({ required: true, content: { "application/json": { schema: { $ref: `#/components/schemas/${component}` } } } });

export const webhookOperations = {
  "GET /api/v1/webhook-endpoints": {
    operationId: "listWebhookEndpoints",
    tags: ["Webhooks"],
    summary: "List webhook endpoints",
    responses: { "200": jsonResponse("The organization's endpoints.", "WebhookEndpointList") },
  },
  "POST /api/v1/webhook-endpoints": {
    operationId: "createWebhookEndpoint",
    tags: ["Webhooks"],
    summary: "Register a webhook endpoint",
    description: "Deliveries follow Standard Webhooks v1 (webhook-id, webhook-timestamp, webhook-signature). The signing secret (`whsec_...`) is in the answer. Loopback, private and metadata addresses are refused.",
    requestBody: body("WebhookEndpointCreate"),
    responses: { "201": jsonResponse("Registered; `secret` is shown in full this once.", "WebhookEndpointCreated"), "422": problemResponse("Invalid body or a refused URL.") },
  },
  "GET /api/v1/webhook-endpoints/[endpointId]": {
    operationId: "getWebhookEndpoint",
    tags: ["Webhooks"],
    summary: "Read a webhook endpoint",
    parameters: [endpointId],
    responses: { "200": jsonResponse("The endpoint.", "WebhookEndpoint"), "404": notFound },
  },
  "PATCH /api/v1/webhook-endpoints/[endpointId]": {
    operationId: "updateWebhookEndpoint",
    tags: ["Webhooks"],
    summary: "Change a webhook endpoint",
    parameters: [endpointId],
    requestBody: body("WebhookEndpointUpdate"),
    responses: { "200": jsonResponse("The changed endpoint.", "WebhookEndpoint"), "404": notFound, "422": problemResponse("Invalid body.") },
  },
  "DELETE /api/v1/webhook-endpoints/[endpointId]": {
    operationId: "deleteWebhookEndpoint",
    tags: ["Webhooks"],
    summary: "Remove a webhook endpoint",
    parameters: [endpointId],
    responses: { "204": { description: "Removed." }, "404": notFound },
  },
  "POST /api/v1/webhook-endpoints/[endpointId]/rotate-secret": {
    operationId: "rotateWebhookSecret",
    tags: ["Webhooks"],
    summary: "Rotate the signing secret",
    description: "During the overlap deliveries carry two signatures, one per secret.",
    parameters: [endpointId],
    responses: { "200": jsonResponse("The new secret.", "WebhookSecretRotated"), "404": notFound },
  },
  "POST /api/v1/webhook-endpoints/[endpointId]/test": {
    operationId: "testWebhookEndpoint",
    tags: ["Webhooks"],
    summary: "Send a test event",
    parameters: [endpointId],
    responses: { "202": jsonResponse("Queued; the delivery log shows the attempt.", "WebhookTestQueued"), "404": notFound },
  },
} satisfies Record<string, Operation>;
