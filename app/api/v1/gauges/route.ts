import { listGaugesOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import { gaugeTables } from "@/lib/services/setup";

export const GET = route(listGaugesOperation, async ({ query }) => ({ body: gaugeTables(query.family) }));
