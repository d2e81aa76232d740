import { recommendSetup } from "@/lib/api/operations/catalog";
import { route } from "@/lib/api/route";
import { setupFor } from "@/lib/services/setup";

export const POST = route(recommendSetup, async ({ em, principal, body }) => ({
  body: await setupFor(em, principal.shopId, body),
}));
