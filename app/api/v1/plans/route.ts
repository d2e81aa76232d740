import { createPlan, listPlans } from "@/lib/api/operations/plans";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const GET = route(listPlans, async ({ em, principal, query }) => ({
  body: await plans.listPlans(em, principal.shopId, query),
}));

export const POST = route(createPlan, async ({ em, principal, body }) => {
  const plan = await plans.createPlan(em, principal.shopId, body);
  return { status: 201, body: plan, headers: { Location: `/api/v1/plans/${plan.id}` } };
});
