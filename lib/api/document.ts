import { buildOpenApi } from "./openapi";
import { operations } from "./operations";
import { ProgramInputSchema } from "../schemas/program";
import { z } from "../schemas/zod";

let cached: ReturnType<typeof buildOpenApi> | undefined;

/** The OpenAPI document of API v1 (built once per process). */
export function openApiDocument() {
  cached ??= buildOpenApi(operations);
  return cached;
}

/** The cut program's JSON Schema, from the same zod schema that validates POST /programs. */
export function cutProgramJsonSchema() {
  return {
    $id: "/api/v1/schemas/cut-program.json",
    title: "Shearwire cut program",
    ...z.toJSONSchema(ProgramInputSchema, { target: "draft-2020-12", io: "input" }),
  };
}
