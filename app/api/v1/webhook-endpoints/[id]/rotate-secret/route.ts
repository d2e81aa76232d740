import { rotateSecretOperation } from "@/lib/api/operations/webhooks";
import { route } from "@/lib/api/route";
import * as webhooks from "@/lib/services/webhooks";

export const POST = route(rotateSecretOperation, async ({ em, principal, params, body }) => ({
  body: await webhooks.rotateSecret(em, principal.shopId, params.id, body?.overlapHours),
}));
