import { adjustStockOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const POST = route(adjustStockOperation, async ({ em, principal, params, body }) => ({
  body: await stock.adjustStock(em, principal.shopId, params.id, body),
}));
