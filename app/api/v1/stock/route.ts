import { createStockItemOperation, listStockOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const GET = route(listStockOperation, async ({ em, principal, query }) => ({
  body: await stock.listStock(em, principal.shopId, query),
}));

export const POST = route(createStockItemOperation, async ({ em, principal, body }) => ({
  status: 201,
  body: await stock.createStockItem(em, principal.shopId, body),
}));
