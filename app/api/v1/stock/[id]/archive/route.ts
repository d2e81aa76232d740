import { archiveStockItemOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const POST = route(archiveStockItemOperation, async ({ em, principal, params }) => ({
  body: await stock.archiveStockItem(em, principal.shopId, params.id),
}));
