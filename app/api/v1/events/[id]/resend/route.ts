import { resendEventOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const POST = route(resendEventOperation, async ({ em, principal, params, body }) => ({
  status: 202,
  body: await webhooks.resend(em, principal.shopId, params.id, body.endpoint),
}));
