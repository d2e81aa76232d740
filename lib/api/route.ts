/**
 * The one wrapper every /api/v1 route handler goes through: request id, API-key auth and
 * scope, rate limit, zod parsing of path, query and body, Idempotency-Key on POST, errors
 * as problem+json, `Cache-Control: no-store`, and a request-log row. Handlers receive
 * parsed input and an entity manager of their own, call a service, and return data.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import type { z } from "zod";
import { requestEm } from "../db/orm";
import { newId } from "../ids";
import { authenticate, type Principal } from "../services/keys";
import {
  ApiError, badRequest, forbidden, internalError, invalidRequest, payloadTooLarge, unsupportedMediaType,
} from "./errors";
import * as idempotency from "./idempotency";
import type { Infer, Operation } from "./operation";
import { consume } from "./rate-limit";
import { logRequest } from "./request-log";

export const API_PREFIX = "/api/v1";
export const MAX_BODY_BYTES = Number(process.env.SHEARWIRE_MAX_BODY_BYTES ?? 1_048_576);

export interface HandlerContext<P, Q, B> {
  em: EntityManager;
  principal: Principal;
  params: P;
  query: Q;
  body: B;
  request: Request;
  requestId: string;
  /** the If-Match value, when the operation requires one */
  ifMatch: string | null;
}

export interface Reply {
  status?: number;
  body?: unknown;
  headers?: Record<string, string>;
}

type RouteContext = { params: Promise<Record<string, string | string[]>> };

const escapePointer = (s: string | number | symbol) => String(s).replace(/~/g, "~0").replace(/\//g, "~1");

export function zodErrors(location: "body" | "query" | "path" | "header", error: z.ZodError) {
  return error.issues.map((i) => ({
    location,
    pointer: i.path.length ? `/${i.path.map(escapePointer).join("/")}` : "",
    message: i.message,
  }));
}

function parse<T extends z.ZodType | undefined>(schema: T | undefined, value: unknown, location: "body" | "query" | "path"): Infer<T> {
  if (!schema) return undefined as Infer<T>;
  const result = schema.safeParse(value);
  if (!result.success) {
    const errors = zodErrors(location, result.error);
    throw invalidRequest(`The ${location === "path" ? "path" : location} has ${errors.length} problem${errors.length === 1 ? "" : "s"}: ${errors.map((e) => `${e.pointer || "(root)"} ${e.message}`).join("; ")}.`, errors);
  }
  return result.data as Infer<T>;
}

async function readBody(request: Request): Promise<string> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > MAX_BODY_BYTES) throw payloadTooLarge(MAX_BODY_BYTES);
  const text = await request.text();
  if (Buffer.byteLength(text) > MAX_BODY_BYTES) throw payloadTooLarge(MAX_BODY_BYTES);
  return text;
}

function queryObject(url: URL): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [k, v] of url.searchParams) {
    const prev = out[k];
    out[k] = prev === undefined ? v : Array.isArray(prev) ? [...prev, v] : [prev, v];
  }
  return out;
}

function json(status: number, body: unknown, headers: Record<string, string>, problem = false): Response {
  const h = new Headers(headers);
  if (body !== undefined) h.set("Content-Type", problem ? "application/problem+json" : "application/json");
  return new Response(body === undefined || status === 204 ? null : JSON.stringify(body), { status, headers: h });
}

export function route<P extends z.ZodObject<z.ZodRawShape> | undefined, Q extends z.ZodObject<z.ZodRawShape> | undefined, B extends z.ZodType | undefined>(
  op: Operation<P, Q, B>,
  handler: (ctx: HandlerContext<Infer<P>, Infer<Q>, Infer<B>>) => Promise<Reply>,
) {
  const routeTemplate = `${API_PREFIX}${op.path}`;
  const method = op.method.toUpperCase();

  return async function handle(request: Request, context: RouteContext): Promise<Response> {
    const started = performance.now();
    const requestId = newId("request");
    const url = new URL(request.url);
    const headers: Record<string, string> = { "X-Request-Id": requestId, "Cache-Control": "no-store" };
    let em: EntityManager | undefined;
    let principal: Principal | null = null;
    let idemKey: string | null = null;
    let reserved = false;
    let response: Response;
    let errorType: string | null = null;
    /** Server-Timing entries, so integrators can see where a slow request spent its time */
    const timing: string[] = [];

    try {
      if (op.scope) {
        em = await requestEm();
        let t = performance.now();
        principal = await authenticate(em, request.headers.get("authorization"));
        timing.push(`auth;dur=${(performance.now() - t).toFixed(1)}`);
        t = performance.now();
        Object.assign(headers, await consume(principal.keyId, principal.rateLimitPerMin));
        timing.push(`ratelimit;dur=${(performance.now() - t).toFixed(1)}`);
        if (!principal.scopes.includes(op.scope)) {
          throw forbidden(`This operation needs the \`${op.scope}\` scope; the key has ${principal.scopes.map((s) => `\`${s}\``).join(", ") || "none"}.`, { requiredScope: op.scope });
        }
      }
      const params = parse(op.params, await context.params, "path");
      const query = parse(op.query, queryObject(url), "query");

      let rawBody = "";
      let body: Infer<B> = undefined as Infer<B>;
      if (op.body) {
        rawBody = await readBody(request);
        const type = request.headers.get("content-type") ?? "";
        if (rawBody.length > 0 && !/^application\/([\w.+-]+\+)?json\b/i.test(type)) throw unsupportedMediaType();
        let value: unknown;
        try {
          value = rawBody.length ? JSON.parse(rawBody) : undefined;
        } catch (err) {
          throw badRequest(`The body is not valid JSON: ${(err as Error).message}`);
        }
        body = parse(op.body, value, "body");
      }

      const ifMatch = request.headers.get("if-match");
      idemKey = op.method === "post" ? request.headers.get("idempotency-key") : null;
      if (idemKey !== null && principal) {
        idempotency.checkKeyFormat(idemKey);
        const claim = await idempotency.claim(em!, principal.keyId, idemKey, method, url.pathname, idempotency.fingerprint(method, url.pathname, rawBody));
        if (claim.kind === "replay") {
          const r = claim.response;
          response = json(r.status, r.body, { ...r.headers, ...headers, "Idempotent-Replayed": "true" }, r.status >= 400);
          return response;
        }
        reserved = true;
      }

      const handlerStarted = performance.now();
      const reply = await handler({
        // public operations (no scope) get no entity manager; they open what they need themselves
        em: em as EntityManager, principal: principal!, params, query, body, request, requestId, ifMatch,
      });
      const status = reply.status ?? 200;
      timing.push(`handler;dur=${(performance.now() - handlerStarted).toFixed(1)}`);
      headers["Server-Timing"] = timing.join(", ");
      response = json(status, reply.body, { ...(reply.headers ?? {}), ...headers });
      if (reserved) await idempotency.complete(em!, principal!.keyId, idemKey!, { status, body: reply.body ?? null, headers: reply.headers ?? {} });
      return response;
    } catch (err) {
      const apiError = err instanceof ApiError ? err : internalError();
      if (!(err instanceof ApiError)) console.error(`[api] ${requestId} ${method} ${routeTemplate}:`, err);
      errorType = apiError.slug;
      const problem = apiError.toProblem(requestId, url.pathname);
      response = json(apiError.status, problem, { ...apiError.headers, ...headers }, true);
      if (reserved) {
        if (apiError.status >= 500) await idempotency.release(em!, principal!.keyId, idemKey!).catch(() => undefined);
        else await idempotency.complete(em!, principal!.keyId, idemKey!, { status: apiError.status, body: problem, headers: apiError.headers }).catch(() => undefined);
      }
      return response;
    } finally {
      // Public operations (health, the documents) are not logged: they carry no key and no shop.
      if (em) {
        logRequest({
          id: requestId,
          shopId: principal?.shopId ?? null,
          keyId: principal?.keyId ?? null,
          method,
          route: routeTemplate,
          path: url.pathname,
          status: response!?.status ?? 500,
          latencyMs: Math.round((performance.now() - started) * 100) / 100,
          idempotencyKey: idemKey,
          errorType,
          createdAt: new Date(),
        });
      }
    }
  };
}
