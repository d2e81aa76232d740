import { releaseProgramOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programs from "@/lib/services/programs";

export const POST = route(releaseProgramOperation, async ({ em, principal, params, body }) => {
  const program = await programs.releaseProgram(em, principal.shopId, params.id, body?.acknowledge);
  return { body: program, headers: { ETag: programs.etagOf(program.revision) } };
});
