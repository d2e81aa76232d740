import { listEventsOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const GET = route(listEventsOperation, async ({ em, principal, query }) => ({
  body: await webhooks.listEvents(em, principal.shopId, query),
}));
