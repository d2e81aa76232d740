import { getShearOperation, updateShearOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import * as catalog from "@/lib/services/catalog";

export const GET = route(getShearOperation, async ({ em, principal, params }) => ({
  body: catalog.viewShear(await catalog.findShear(em, principal.shopId, params.id)),
}));

export const PATCH = route(updateShearOperation, async ({ em, principal, params, body }) => ({
  body: await catalog.updateShear(em, principal.shopId, params.id, body),
}));
