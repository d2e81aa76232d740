import { createStockItem, listStock } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const GET = route(listStock, async ({ em, principal, query }) => ({
  body: await stock.listStock(em, principal.shopId, query),
}));

export const POST = route(createStockItem, async ({ em, principal, body }) => ({
  status: 201,
  body: await stock.createStockItem(em, principal.shopId, body),
}));
