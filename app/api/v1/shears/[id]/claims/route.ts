import { claimProgramOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";
import { stoppingSignal } from "@/lib/shutdown";

export const POST = route(claimProgramOperation, async ({ em, principal, params, body, request }) => {
  // the wait ends when the client goes away or the server begins to stop (then it answers 204 at once)
  const signal = AbortSignal.any([request.signal, stoppingSignal]);
  const claim = await gateway.claimNext(em, principal, params.id, { ...body, signal });
  return claim ? { body: claim } : { status: 204 };
});
