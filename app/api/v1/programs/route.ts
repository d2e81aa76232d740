import { createProgramOperation, listProgramsOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programList from "@/lib/services/program-list";
import * as programs from "@/lib/services/programs";

export const GET = route(listProgramsOperation, async ({ em, principal, query }) => ({
  body: await programList.listPrograms(em, principal.shopId, query),
}));

export const POST = route(createProgramOperation, async ({ em, principal, body }) => {
  const program = await programs.createProgram(em, principal.shopId, body);
  return {
    status: 201,
    body: program,
    headers: { ETag: programs.etagOf(program.revision), Location: `/api/v1/programs/${program.id}` },
  };
});
