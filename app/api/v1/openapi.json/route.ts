import { openApiDocument } from "@/lib/api/document";
import { getOpenApi } from "@/lib/api/operations/meta";
import { route } from "@/lib/api/route";

export const GET = route(getOpenApi, async () => ({ body: openApiDocument() }));
