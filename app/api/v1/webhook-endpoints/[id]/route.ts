import { deleteEndpoint, getEndpoint, updateEndpoint } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(getEndpoint, async ({ em, principal, params }) => ({
  body: webhooks.viewEndpoint(await webhooks.findEndpoint(em, principal.shopId, params.id)),
}));

export const PATCH = route(updateEndpoint, async ({ em, principal, params, body }) => ({
  body: await webhooks.updateEndpoint(em, principal.shopId, params.id, body),
}));

export const DELETE = route(deleteEndpoint, async ({ em, principal, params }) => {
  await webhooks.deleteEndpoint(em, principal.shopId, params.id);
  return { status: 204 };
});
