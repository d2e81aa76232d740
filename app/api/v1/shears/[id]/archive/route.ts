import { archiveShearOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const POST = route(archiveShearOperation, async ({ em, principal, params }) => ({
  body: await catalog.archiveShear(em, principal.shopId, params.id),
}));
