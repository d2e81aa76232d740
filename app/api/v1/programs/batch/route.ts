import { createProgramBatchOperation } from "@/lib/api/operations/programs";
import { route } from "@/lib/api/route";
import { holdsRememberedJson } from "@/lib/json-text";
import * as batch from "@/lib/services/program-batch";

export const POST = route(createProgramBatchOperation, async ({ em, principal, body }) =>
  body.atomic
    ? { status: 201, body: holdsRememberedJson({ data: await batch.createBatch(em, principal.shopId, body.programs) }) }
    : { status: 207, body: holdsRememberedJson({ data: await batch.createEach(em, principal.shopId, body.programs) }) },
);
