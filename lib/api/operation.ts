/**
 * An API operation: everything the route wrapper needs to run it and everything the
 * OpenAPI document says about it, in one object. Route handlers are built from these, and
 * the document is generated from the same list, so the two cannot drift apart.
 */
import type { z } from "zod";
import type { Scope } from "../../lib/schemas/enums";

export type Method = "get" | "post" | "patch" | "put" | "delete";

type ZObject = z.ZodObject<z.ZodRawShape>;

export interface ResponseSpec {
  description: string;
  schema?: z.ZodType;
  headers?: Record<string, { description: string; schema: { type: "string" | "integer" } }>;
}

export interface Operation<
  P extends ZObject | undefined = ZObject | undefined,
  Q extends ZObject | undefined = ZObject | undefined,
  B extends z.ZodType | undefined = z.ZodType | undefined,
> {
  operationId: string;
  method: Method;
  /** the OpenAPI path under /api/v1, e.g. "/programs/{id}" */
  path: string;
  summary: string;
  description?: string;
  tags: string[];
  /** the scope an API key must hold; null for a public operation */
  scope: Scope | null;
  params?: P;
  query?: Q;
  body?: B;
  /** the success responses; error responses are added from the operation's traits */
  responses: Record<number, ResponseSpec>;
  /** needs If-Match (412 on a stale revision, 428 when missing) */
  ifMatch?: boolean;
  /** extra error statuses this operation can answer, besides the common ones */
  errors?: number[];
  /** request headers the operation reads, besides the common ones (documented; the handler reads them) */
  requestHeaders?: { name: string; description: string; schema: { type: "string" | "integer"; maxLength?: number } }[];
}

export type Infer<T> = T extends z.ZodType ? z.infer<T> : undefined;

export function defineOperation<
  P extends ZObject | undefined = undefined,
  Q extends ZObject | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
>(op: Operation<P, Q, B>): Operation<P, Q, B> {
  return op;
}
