import { previewPlanOperation } from "@/lib/api/operations/plans";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const POST = route(previewPlanOperation, async ({ em, principal, body }) => ({
  body: await plans.previewPlan(em, principal.shopId, body),
}));
