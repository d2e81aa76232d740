import { releaseReservationOperation } from "@/lib/api/operations/stock";
import { route } from "@/lib/api/route";
import * as stock from "@/lib/services/stock";

export const POST = route(releaseReservationOperation, async ({ em, principal, params }) => ({
  body: await stock.releaseReservation(em, principal.shopId, params.id),
}));
