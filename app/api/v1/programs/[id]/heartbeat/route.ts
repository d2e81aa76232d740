import { heartbeatProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(heartbeatProgramOperation, async ({ em, principal, params, body }) => ({
  body: await gateway.heartbeat(em, principal, params.id, body?.leaseSeconds),
}));
