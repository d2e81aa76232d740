import { reserveStockOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const POST = route(reserveStockOperation, async ({ em, principal, params, body }) => ({
  status: 201,
  body: await stock.reserveStock(em, principal.shopId, params.id, body),
}));
