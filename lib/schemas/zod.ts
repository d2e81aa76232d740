/** zod, extended once with `.openapi()` so every schema can describe itself in the OpenAPI document. */
import { extendZodWithOpenApi } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";

extendZodWithOpenApi(z);

export { z };
