import { writePlanProgramsOperation } from "@/lib/api/operations/plans";
import { route } from "@/lib/api/route";
import * as plans from "@/lib/services/plans";

export const POST = route(writePlanProgramsOperation, async ({ em, principal, params, body }) => ({
  status: 201,
  body: await plans.writePrograms(em, principal.shopId, params.id, body ?? {}),
}));
