import { recommendSetupOperation } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import { setupFor } from "@/lib/services/setup";

export const POST = route(recommendSetupOperation, async ({ em, principal, body }) => ({
  body: await setupFor(em, principal.shopId, body),
}));
