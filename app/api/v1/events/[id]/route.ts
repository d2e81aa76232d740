import { getEventOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(getEventOperation, async ({ em, principal, params }) => ({
  body: await webhooks.getEvent(em, principal.shopId, params.id),
}));
