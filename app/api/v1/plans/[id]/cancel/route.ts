import { cancelPlanOperation } from "@/lib/api/operations/plans";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const POST = route(cancelPlanOperation, async ({ em, principal, params }) => ({
  body: await plans.cancelPlan(em, principal.shopId, params.id),
}));
