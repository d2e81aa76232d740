/**
 * An API operation: everything the route wrapper needs to run it and everything the
 * OpenAPI document says about it, in one object. Route handlers are built from these, and
 * the document is generated from the same list, so the two cannot drift apart.
 */
import type { z } from "zod";
import type { Scope } from "../../lib/schemas/enums";

/** Where API v1 is served; operations' paths are under it. */
export const API_PREFIX = "/api/v1";

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
  R extends Record<number, ResponseSpec> = Record<number, ResponseSpec>,
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
  responses: R;
  /**
   * writes many programs in one request: after authorisation and reading its body's text, at most a few such requests
   * go on at once in one web server and the others wait their turn (`lib/api/route.ts`)
   */
  heavy?: boolean;
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
  const R extends Record<number, ResponseSpec> = Record<number, ResponseSpec>,
>(op: Operation<P, Q, B, R>): Operation<P, Q, B, R> {
  return op;
}

/** The body a response answers with: its schema's type, or nothing when it declares none. */
type BodyOf<S> = S extends { schema: infer Z extends z.ZodType } ? z.infer<Z> : undefined;

/**
 * What a handler may return for an operation: one of its declared success statuses (200 when
 * left out) with that response's body type, so a handler returning the wrong shape fails to compile.
 */
export type ReplyOf<R extends Record<number, ResponseSpec>> = {
  [K in Extract<keyof R, number>]: { status?: K; body?: BodyOf<R[K]>; headers?: Record<string, string> };
}[Extract<keyof R, number>];
