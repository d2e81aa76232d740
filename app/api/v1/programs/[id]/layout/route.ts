import { getProgramLayoutOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programs from "@/lib/services/programs";

export const GET = route(getProgramLayoutOperation, async ({ em, principal, params }) => {
  const layout = await programs.readProgramLayout(em, await programs.findProgram(em, principal.shopId, params.id));
  return { body: layout, headers: { ETag: programs.etagOf(layout.revision) } };
});
