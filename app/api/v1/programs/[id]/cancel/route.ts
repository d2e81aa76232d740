import { cancelProgramOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programs from "@/lib/services/programs";

export const POST = route(cancelProgramOperation, async ({ em, principal, params, body }) => {
  const program = await programs.cancelProgram(em, principal.shopId, params.id, body?.reason);
  return { body: program, headers: { ETag: programs.etagOf(program.revision) } };
});
