import { deleteEndpointOperation, getEndpointOperation, updateEndpointOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(getEndpointOperation, async ({ em, principal, params }) => ({
  body: await webhooks.getEndpoint(em, principal.shopId, params.id),
}));

export const PATCH = route(updateEndpointOperation, async ({ em, principal, params, body }) => ({
  body: await webhooks.updateEndpoint(em, principal.shopId, params.id, body),
}));

export const DELETE = route(deleteEndpointOperation, async ({ em, principal, params }) => {
  await webhooks.deleteEndpoint(em, principal.shopId, params.id);
  return { status: 204 };
});
