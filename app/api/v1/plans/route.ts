import { createPlanOperation, listPlansOperation } from "@/lib/api/operations/plans";
import { preferredWait } from "@/lib/api/prefer";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const GET = route(listPlansOperation, async ({ em, principal, query }) => ({
  body: await plans.listPlans(em, principal.shopId, query),
}));

export const POST = route(createPlanOperation, async ({ em, principal, body, request }) => {
  let plan = await plans.createPlan(em, principal.shopId, body);
  const headers: Record<string, string> = { Location: `/api/v1/plans/${plan.id}` };
  const wait = preferredWait(request.headers.get("prefer"), plans.MAX_WAIT_SECONDS);
  if (wait !== null) {
    plan = await plans.waitForPlan(em, principal.shopId, plan.id, wait);
    headers["Preference-Applied"] = `wait=${wait}`;
  }
  return { status: plan.status === "complete" && wait !== null ? 201 : 202, body: plan, headers };
});
