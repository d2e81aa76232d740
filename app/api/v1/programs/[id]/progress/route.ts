import { reportProgressOperation } from "@/lib/api/operations/gateway";
import { route } from "@/lib/api/route";
import * as gateway from "@/lib/services/gateway";

export const POST = route(reportProgressOperation, async ({ em, principal, params, body }) => ({
  body: await gateway.progress(em, principal, params.id, body),
}));
