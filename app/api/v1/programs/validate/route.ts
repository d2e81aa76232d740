import { validateProgramOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programs from "@/lib/services/programs";

export const POST = route(validateProgramOperation, async ({ em, principal, body }) => ({
  body: await programs.validateProgram(em, principal.shopId, body),
}));
