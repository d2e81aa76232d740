import { getProgramLayoutOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import * as programs from "@/lib/services/programs";

export const GET = route(getProgramLayoutOperation, async ({ em, principal, params }) => {
  const { layout, revision } = await programs.readProgramLayout(em, principal.shopId, params.id);
  return { body: layout, headers: { ETag: programs.etagOf(revision) } };
});
