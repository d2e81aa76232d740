import { openApiDocument } from "@/lib/api/document";
import { getOpenApiOperation } from "@/lib/api/operations/meta";
import { route } from "@/lib/api/route";

// The document's own type has no index signature; it is the JSON object the operation declares.
export const GET = route(getOpenApiOperation, async () => ({
  body: openApiDocument() as unknown as Record<string, unknown>,
}));
