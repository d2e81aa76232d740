import { archiveGradeOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const POST = route(archiveGradeOperation, async ({ em, principal, params }) => ({
  body: await catalog.archiveGrade(em, principal.shopId, params.id),
}));
