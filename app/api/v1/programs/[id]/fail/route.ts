import { failProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(failProgramOperation, async ({ em, principal, params, body }) => ({
  body: await gateway.fail(em, principal, params.id, body),
}));
