import { createEndpointOperation, listEndpointsOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(listEndpointsOperation, async ({ em, principal, query }) => ({
  body: await webhooks.listEndpoints(em, principal.shopId, query),
}));

export const POST = route(createEndpointOperation, async ({ em, principal, body }) => ({
  status: 201,
  body: await webhooks.createEndpoint(em, principal.shopId, body),
}));
