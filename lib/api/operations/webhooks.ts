import { defineOperation } from "../operation";
import { idParam, listOf, PaginationSchema } from "../../schemas/common";
import {
  DeliverySchema,
  EndpointSchema,
  EndpointInputSchema,
  EndpointPatchSchema,
  EndpointWithSecretSchema,
  EventSchema,
  EventQuerySchema,
  ResendInputSchema,
  RotateInputSchema,
} from "../../schemas/webhook";

const tags = ["Webhooks"];
const endpointParams = idParam("whe", "webhook endpoint");
const eventParams = idParam("evt", "event");
const DeliveryList = listOf(DeliverySchema, "DeliveryList");

export const listEndpointsOperation = defineOperation({
  operationId: "listWebhookEndpoints",
  method: "get",
  path: "/webhook-endpoints",
  tags,
  scope: "webhooks:write",
  summary: "List webhook endpoints",
  query: PaginationSchema,
  responses: { 200: { description: "A page of endpoints.", schema: listOf(EndpointSchema, "WebhookEndpointList") } },
});
export const createEndpointOperation = defineOperation({
  operationId: "createWebhookEndpoint",
  method: "post",
  path: "/webhook-endpoints",
  tags,
  scope: "webhooks:write",
  summary: "Add a webhook endpoint",
  description:
    "Answers the signing secret (`whsec_…`) this once. Deliveries follow Standard Webhooks: verify `webhook-signature` over `webhook-id.webhook-timestamp.body`, and de-duplicate on `webhook-id` (delivery is at least once).",
  body: EndpointInputSchema,
  responses: { 201: { description: "Created, with its secret.", schema: EndpointWithSecretSchema } },
});
export const getEndpointOperation = defineOperation({
  operationId: "getWebhookEndpoint",
  method: "get",
  path: "/webhook-endpoints/{id}",
  tags,
  scope: "webhooks:write",
  summary: "Read a webhook endpoint",
  params: endpointParams,
  responses: { 200: { description: "The endpoint.", schema: EndpointSchema } },
});
export const updateEndpointOperation = defineOperation({
  operationId: "updateWebhookEndpoint",
  method: "patch",
  path: "/webhook-endpoints/{id}",
  tags,
  scope: "webhooks:write",
  summary: "Change a webhook endpoint",
  description:
    "Change the URL, description or event types, or enable and disable it. Enabling resets the failure count.",
  params: endpointParams,
  body: EndpointPatchSchema,
  responses: { 200: { description: "The changed endpoint.", schema: EndpointSchema } },
});
export const deleteEndpointOperation = defineOperation({
  operationId: "deleteWebhookEndpoint",
  method: "delete",
  path: "/webhook-endpoints/{id}",
  tags,
  scope: "webhooks:write",
  summary: "Remove a webhook endpoint",
  params: endpointParams,
  responses: { 204: { description: "Removed, with its deliveries." } },
});
export const rotateSecretOperation = defineOperation({
  operationId: "rotateWebhookSecret",
  method: "post",
  path: "/webhook-endpoints/{id}/rotate-secret",
  tags,
  scope: "webhooks:write",
  summary: "Rotate the signing secret",
  description:
    "Answers the new secret this once. For `overlapHours` (default 24) deliveries carry two signatures, one per secret, so receivers can switch without missing an event.",
  params: endpointParams,
  body: RotateInputSchema,
  responses: { 200: { description: "The endpoint and its new secret.", schema: EndpointWithSecretSchema } },
});
export const testEndpointOperation = defineOperation({
  operationId: "testWebhookEndpoint",
  method: "post",
  path: "/webhook-endpoints/{id}/test",
  tags,
  scope: "webhooks:write",
  summary: "Send a test event",
  description: "Sends an `endpoint.test` event to this endpoint only.",
  params: endpointParams,
  errors: [409],
  responses: { 202: { description: "Queued; follow the delivery.", schema: DeliverySchema } },
});
export const listEndpointDeliveriesOperation = defineOperation({
  operationId: "listEndpointDeliveries",
  method: "get",
  path: "/webhook-endpoints/{id}/deliveries",
  tags,
  scope: "events:read",
  summary: "Deliveries to an endpoint",
  description: "Newest first, each with its attempts.",
  params: endpointParams,
  query: PaginationSchema,
  responses: { 200: { description: "A page of deliveries.", schema: DeliveryList } },
});

export const listEventsOperation = defineOperation({
  operationId: "listEvents",
  method: "get",
  path: "/events",
  tags,
  scope: "events:read",
  summary: "List events",
  description: "Everything that happened in the shop, newest first.",
  query: PaginationSchema.extend(EventQuerySchema.shape),
  responses: { 200: { description: "A page of events.", schema: listOf(EventSchema, "EventList") } },
});
export const getEventOperation = defineOperation({
  operationId: "getEvent",
  method: "get",
  path: "/events/{id}",
  tags,
  scope: "events:read",
  summary: "Read an event",
  params: eventParams,
  responses: { 200: { description: "The event.", schema: EventSchema } },
});
export const listEventDeliveriesOperation = defineOperation({
  operationId: "listEventDeliveries",
  method: "get",
  path: "/events/{id}/deliveries",
  tags,
  scope: "events:read",
  summary: "Deliveries of an event",
  params: eventParams,
  query: PaginationSchema,
  responses: { 200: { description: "A page of deliveries.", schema: DeliveryList } },
});
export const resendEventOperation = defineOperation({
  operationId: "resendEvent",
  method: "post",
  path: "/events/{id}/resend",
  tags,
  scope: "webhooks:write",
  summary: "Resend an event to an endpoint",
  description: "A new delivery of the same event (same `webhook-id`) to one endpoint.",
  params: eventParams,
  body: ResendInputSchema,
  errors: [409],
  responses: { 202: { description: "Queued; follow the delivery.", schema: DeliverySchema } },
});

export const webhookOperations = [
  listEndpointsOperation,
  createEndpointOperation,
  getEndpointOperation,
  updateEndpointOperation,
  deleteEndpointOperation,
  rotateSecretOperation,
  testEndpointOperation,
  listEndpointDeliveriesOperation,
  listEventsOperation,
  getEventOperation,
  listEventDeliveriesOperation,
  resendEventOperation,
];
