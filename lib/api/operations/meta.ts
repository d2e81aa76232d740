import { defineOperation } from "../operation";
import { z } from "../../schemas/zod";

const tags = ["Meta"];
const Component = z.object({ status: z.enum(["up", "down"]), latencyMs: z.number(), error: z.string().optional() });
export const Health = z
  .object({
    status: z.enum(["ok", "degraded"]),
    version: z.string(),
    time: z.string(),
    database: Component,
    redis: Component,
  })
  .openapi("Health");

export const getHealthOperation = defineOperation({
  operationId: "getHealth",
  method: "get",
  path: "/health",
  tags,
  scope: null,
  summary: "Health",
  description: "Database and Redis reachability and the running version. No key needed.",
  responses: {
    200: { description: "All up.", schema: Health },
    503: { description: "Something is down.", schema: Health },
  },
});
export const getOpenApiOperation = defineOperation({
  operationId: "getOpenApi",
  method: "get",
  path: "/openapi.json",
  tags,
  scope: null,
  summary: "This OpenAPI document",
  responses: { 200: { description: "The OpenAPI 3.1 document.", schema: z.record(z.string(), z.unknown()) } },
});
export const getCutProgramSchemaOperation = defineOperation({
  operationId: "getCutProgramSchema",
  method: "get",
  path: "/schemas/cut-program.json",
  tags,
  scope: null,
  summary: "Cut program JSON Schema",
  description: "The JSON Schema (2020-12) of the cut program you send to `POST /programs`.",
  responses: { 200: { description: "The JSON Schema.", schema: z.record(z.string(), z.unknown()) } },
});

export const metaOperations = [getHealthOperation, getOpenApiOperation, getCutProgramSchemaOperation];
