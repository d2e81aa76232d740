import { startProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(startProgramOperation, async ({ em, principal, params }) => ({
  body: await gateway.start(em, principal, params.id),
}));
