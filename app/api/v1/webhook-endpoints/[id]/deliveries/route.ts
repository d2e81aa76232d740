import { listEndpointDeliveriesOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(listEndpointDeliveriesOperation, async ({ em, principal, params, query }) => ({
  body: await webhooks.listDeliveries(em, principal.shopId, { endpoint: params.id }, query),
}));
