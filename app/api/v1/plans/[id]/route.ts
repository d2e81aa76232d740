import { getPlanOperation } from "@/lib/api/operations/plans";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const GET = route(getPlanOperation, async ({ em, principal, params }) => ({
  body: await plans.getPlan(em, principal.shopId, params.id),
}));
