import { createGradeOperation, listGradesOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const GET = route(listGradesOperation, async ({ em, principal, query }) => ({
  body: await catalog.listGrades(em, principal.shopId, {
    ...query,
    includeArchived: (query.includeArchived ?? query.include_archived) === "true",
  }),
}));

export const POST = route(createGradeOperation, async ({ em, principal, body }) => ({
  status: 201,
  body: await catalog.createGrade(em, principal.shopId, body),
}));
