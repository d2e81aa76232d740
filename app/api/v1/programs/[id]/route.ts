import { getProgramOperation, updateProgramOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import { viewProgram } from "@/lib/services/program-view";
import * as programs from "@/lib/services/programs";

export const GET = route(getProgramOperation, async ({ em, principal, params }) => {
  const program = await programs.findProgram(em, principal.shopId, params.id);
  return { body: viewProgram(program), headers: { ETag: programs.etagOf(program.revision) } };
});

export const PATCH = route(updateProgramOperation, async ({ em, principal, params, body, ifMatch }) => {
  const program = await programs.updateProgram(em, principal.shopId, params.id, body, ifMatch);
  return { body: program, headers: { ETag: programs.etagOf(program.revision) } };
});
