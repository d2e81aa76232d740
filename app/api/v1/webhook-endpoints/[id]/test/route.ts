import { testEndpointOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const POST = route(testEndpointOperation, async ({ em, principal, params }) => ({
  status: 202,
  body: await webhooks.sendTestEvent(em, principal.shopId, params.id),
}));
