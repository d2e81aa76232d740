import { getStockItemOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const GET = route(getStockItemOperation, async ({ em, principal, params }) => ({
  body: await stock.getStockItem(em, principal.shopId, params.id),
}));
