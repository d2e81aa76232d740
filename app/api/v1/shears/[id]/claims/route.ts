import { claimProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(claimProgramOperation, async ({ em, principal, params, body, request }) => {
  const claim = await gateway.claimNext(em, principal, params.id, { ...body, signal: request.signal });
  return claim ? { body: claim } : { status: 204 };
});
