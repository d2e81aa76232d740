import { completeProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(completeProgramOperation, async ({ em, principal, params, body }) => ({
  body: await gateway.complete(em, principal, params.id, body),
}));
