import { cutProgramJsonSchema } from "@/lib/api/document";
import { getCutProgramSchemaOperation } from "@/lib/api/operations/meta";
import { route } from "@/lib/api/route";

export const GET = route(getCutProgramSchemaOperation, async () => ({ body: cutProgramJsonSchema() }));
