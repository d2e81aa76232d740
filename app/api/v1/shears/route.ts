import { createShearOperation, listShearsOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const GET = route(listShearsOperation, async ({ em, principal, query }) => ({
  body: await catalog.listShears(em, principal.shopId, {
    ...query,
    includeArchived: (query.includeArchived ?? query.include_archived) === "true",
  }),
}));

export const POST = route(createShearOperation, async ({ em, principal, body }) => ({
  status: 201,
  body: await catalog.createShear(em, principal.shopId, body),
}));
