import { cutProgramJsonSchema } from "@/lib/api/document";
import { getCutProgramSchema } from "@/lib/api/operations/meta";
import { route } from "@/lib/api/route";

export const GET = route(getCutProgramSchema, async () => ({ body: cutProgramJsonSchema() }));
