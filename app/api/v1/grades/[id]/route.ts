import { getGradeOperation, updateGradeOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const GET = route(getGradeOperation, async ({ em, principal, params }) => ({
  body: catalog.viewGrade(await catalog.findGrade(em, principal.shopId, params.id)),
}));

export const PATCH = route(updateGradeOperation, async ({ em, principal, params, body }) => ({
  body: await catalog.updateGrade(em, principal.shopId, params.id, body),
}));
