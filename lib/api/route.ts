/**
 * The one wrapper every /api/v1 route handler goes through, in named steps: authorise (API
 * key, scope, rate limit), read the input (path, query and body, each parsed by the
 * operation's zod schema after the one text rule of `lib/text.ts`), reserve the
 * Idempotency-Key, run the handler, respond (problem+json for every error, request id,
 * `Cache-Control: no-store`, Server-Timing), and log the request. Handlers receive parsed
 * input and an entity manager of their own, call a service, and return data.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import pLimit from "p-limit";
import type { z } from "zod";
import { requestEm } from "../db/orm";
import { newId } from "../ids";
import { jsonBytes } from "../json-text";
import { authenticate, type Principal } from "../services/keys";
import { SECURITY_HEADERS } from "../security-headers";
import { wholeNumberSetting } from "../settings-env";

import { ApiError, badRequest, forbidden, internalError, unsupportedMediaType } from "../errors";
import * as idempotency from "../services/idempotency";
import { API_PREFIX, type Infer, type Operation, type ReplyOf, type ResponseSpec } from "./operation";
import { consume } from "./rate-limit";
import { logRequest } from "./request-log";
import { parse, plainJsonText, queryObject, readBody } from "./route-input";

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

/** Above this many bytes an answer is handed over as a stream of its one buffer (see `json`). */
const STREAMED_BYTES = 32 * 1024;

/**
 * The response. The body is JSON serialised once (reusing the bytes a created program was written
 * with, lib/json-text.ts) and handed over as bytes: JSON text is always well-formed Unicode, so the
 * string-to-USV pass a string body would get is not needed. A large answer (a batch's runs to ~0.8 MB)
 * goes as a stream holding its one buffer: a buffer given to `Response` is copied whole first, which cost
 * the web server ~1–1.8 ms of CPU per batch answer against ~0.06 ms. (Next.js sends a route handler's
 * answer in chunked encoding either way: it drops the Content-Length of a `Response`.) The buffer is the
 * answer's own or bytes remembered for it (never a pooled one shared with other values), and nothing writes to it.
 */
function json(status: number, body: unknown, headers: Record<string, string>, problem = false): Response {
  const responseHeaders = new Headers(headers);
  if (body !== undefined)
    responseHeaders.set("Content-Type", problem ? "application/problem+json" : "application/json");
  const bytes = body === undefined || status === 204 ? undefined : jsonBytes(body);
  if (bytes && bytes.length > STREAMED_BYTES) {
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(bytes);
        controller.close();
      },
    });
    return new Response(stream, { status, headers: responseHeaders });
  }
  return new Response(bytes ?? null, { status, headers: responseHeaders });
}

/** One request's state as it goes through the steps. */
interface Call {
  started: number;
  requestId: string;
  url: URL;
  method: string;
  routeTemplate: string;
  headers: Record<string, string>;
  /** Server-Timing entries, so integrators can see where a slow request spent its time */
  timing: string[];
  em?: EntityManager;
  principal?: Principal;
  idempotencyKey: string | null;
  reserved: boolean;
  errorType: string | null;
}

async function timed<T>(call: Call, name: string, work: () => Promise<T>): Promise<T> {
  const started = performance.now();
  try {
    return await work();
  } finally {
    call.timing.push(`${name};dur=${(performance.now() - started).toFixed(1)}`);
  }
}

/** Step 1: the API key, its rate limit and the operation's scope (public operations skip this). */
async function authorise(call: Call, op: Operation, request: Request) {
  if (!op.scope) return;
  const em = (call.em = await requestEm());
  const principal = (call.principal = await timed(call, "auth", () =>
    authenticate(em, request.headers.get("authorization")),
  ));
  Object.assign(
    call.headers,
    await timed(call, "ratelimit", () => consume(principal.keyId, principal.rateLimitPerMin)),
  );
  if (!principal.scopes.includes(op.scope)) {
    throw forbidden(
      `This operation needs the \`${op.scope}\` scope; the key has ${principal.scopes.map((s) => `\`${s}\``).join(", ") || "none"}.`,
      { requiredScope: op.scope },
    );
  }
}

/** Step 2: path, query and body (its text already read), parsed by the operation's schemas. */
async function readInput<P, Q, B>(op: Operation, request: Request, context: RouteContext, url: URL, rawBody: string) {
  const params = parse(op.params, await context.params, "path") as P;
  const query = parse(op.query, queryObject(url), "query") as Q;
  let body = undefined as B;
  if (op.body) {
    const type = request.headers.get("content-type") ?? "";
    if (rawBody.length > 0 && !/^application\/([\w.+-]+\+)?json\b/i.test(type)) throw unsupportedMediaType();
    let value: unknown;
    try {
      value = rawBody.length ? JSON.parse(rawBody) : undefined;
    } catch (err) {
      throw badRequest(`The body is not valid JSON: ${(err as Error).message}`);
    }
    body = parse(op.body, value, "body", { textChecked: plainJsonText(rawBody) }) as B;
  }
  return { params, query, body };
}

/** Step 3: reserve the Idempotency-Key, or answer with the response stored for it. */
async function reserveIdempotency(
  call: Call,
  op: Operation,
  request: Request,
  rawBody: string,
): Promise<Response | null> {
  if (op.method !== "post" || !call.principal) return null;
  const key = request.headers.get("idempotency-key");
  if (key === null) return null;
  call.idempotencyKey = key;
  idempotency.checkKeyFormat(key);
  const path = call.url.pathname;
  const claim = await idempotency.claim(
    call.em!,
    call.principal.keyId,
    key,
    call.method,
    path,
    idempotency.fingerprint(call.method, path, rawBody),
  );
  if (claim.kind === "replay") {
    const storedResponse = claim.response;
    return json(
      storedResponse.status,
      storedResponse.body,
      { ...storedResponse.headers, ...call.headers, "Idempotent-Replayed": "true" },
      storedResponse.status >= 400,
    );
  }
  call.reserved = true;
  return null;
}

/** Step 4a: the handler's reply, stored under the Idempotency-Key when one was reserved. */
async function respond(call: Call, reply: Reply): Promise<Response> {
  const status = reply.status ?? 200;
  call.headers["Server-Timing"] = call.timing.join(", ");
  const response = json(status, reply.body, { ...(reply.headers ?? {}), ...call.headers });
  if (call.reserved) {
    await idempotency.complete(call.em!, call.principal!.keyId, call.idempotencyKey!, {
      status,
      body: reply.body ?? null,
      headers: reply.headers ?? {},
    });
  }
  return response;
}

/** Step 4b: any error as problem+json; a reservation is kept for a refusal, released for our own failure. */
async function respondWithProblem(call: Call, err: unknown): Promise<Response> {
  const apiError = err instanceof ApiError ? err : internalError();
  if (!(err instanceof ApiError)) console.error(`[api] ${call.requestId} ${call.method} ${call.routeTemplate}:`, err);
  call.errorType = apiError.slug;
  const problem = apiError.toProblem(call.requestId, call.url.pathname);
  if (call.reserved) {
    const { keyId } = call.principal!;
    if (apiError.status >= 500) await idempotency.release(call.em!, keyId, call.idempotencyKey!).catch(() => undefined);
    else
      await idempotency
        .complete(call.em!, keyId, call.idempotencyKey!, {
          status: apiError.status,
          body: problem,
          headers: apiError.headers,
        })
        .catch(() => undefined);
  }
  return json(apiError.status, problem, { ...apiError.headers, ...call.headers }, true);
}

/** Step 5: the request log (public operations, which carry no key and no shop, are not logged). */
function log(call: Call, status: number) {
  if (!call.em) return;
  logRequest({
    id: call.requestId,
    shopId: call.principal?.shopId ?? null,
    keyId: call.principal?.keyId ?? null,
    method: call.method,
    route: call.routeTemplate,
    path: call.url.pathname,
    status,
    latencyMs: Math.round((performance.now() - call.started) * 100) / 100,
    idempotencyKey: call.idempotencyKey,
    errorType: call.errorType,
    createdAt: new Date(),
  });
}

type Handler = (ctx: HandlerContext<unknown, unknown, unknown>) => Promise<Reply>;

/** Steps 2–4: parse the input, reserve the Idempotency-Key, run the handler and respond. */
async function serveInput(
  call: Call,
  op: Operation,
  request: Request,
  context: RouteContext,
  rawBody: string,
  handler: Handler,
): Promise<Response> {
  const input = await readInput<unknown, unknown, unknown>(op, request, context, call.url, rawBody);
  const replayed = await reserveIdempotency(call, op, request, rawBody);
  if (replayed) return replayed;
  const handlerStarted = performance.now();
  const reply = await handler({
    // public operations (no scope) get no entity manager; they open what they need themselves
    em: call.em as EntityManager,
    principal: call.principal!,
    params: input.params,
    query: input.query,
    body: input.body,
    request,
    requestId: call.requestId,
    ifMatch: request.headers.get("if-match"),
  });
  call.timing.push(`handler;dur=${(performance.now() - handlerStarted).toFixed(1)}`);
  return respond(call, reply);
}

/**
 * How many heavy requests (a batch of programs, a plan's programs) one web server works on at once; the others wait
 * in arrival order, authorised and holding only their body's text (at most `MAX_BODY_BYTES`), until a turn is free,
 * and are parsed and run then. Each running one holds a few megabytes of parsed programs,
 * checks and serialised text while it waits for PostgreSQL: with every request let in at once (32 batches of 100 in
 * the benchmark), most of that survived each young-generation collection, and garbage collection took ~3–3.5 ms of
 * the web server's CPU per batch against ~2 ms with two at a time, for the same throughput. Two keep the web server
 * busy while PostgreSQL writes the other's statement. Light requests never wait here.
 */
export const HEAVY_CONCURRENCY = wholeNumberSetting(process.env, "SHEARWIRE_HEAVY_CONCURRENCY", "requests", () => 2);
const heavyTurn = pLimit(HEAVY_CONCURRENCY);

export function route<
  P extends z.ZodObject<z.ZodRawShape> | undefined,
  Q extends z.ZodObject<z.ZodRawShape> | undefined,
  B extends z.ZodType | undefined,
  R extends Record<number, ResponseSpec>,
>(op: Operation<P, Q, B, R>, handler: (ctx: HandlerContext<Infer<P>, Infer<Q>, Infer<B>>) => Promise<ReplyOf<R>>) {
  const routeTemplate = `${API_PREFIX}${op.path}`;
  const method = op.method.toUpperCase();

  return async function handle(request: Request, context: RouteContext): Promise<Response> {
    const call: Call = {
      started: performance.now(),
      requestId: newId("request"),
      url: new URL(request.url),
      method,
      routeTemplate,
      headers: {},
      timing: [],
      idempotencyKey: null,
      reserved: false,
      errorType: null,
    };
    call.headers = { ...SECURITY_HEADERS, "X-Request-Id": call.requestId, "Cache-Control": "no-store" };
    let response: Response | undefined;
    try {
      await authorise(call, op as Operation, request);
      // The body's text is read before a heavy request waits its turn: a slow upload holds no turn.
      const rawBody = op.body ? await readBody(request) : "";
      const serve = () => serveInput(call, op as Operation, request, context, rawBody, handler as Handler);
      if (op.heavy) {
        const queued = performance.now();
        response = await heavyTurn(() => {
          call.timing.push(`queue;dur=${(performance.now() - queued).toFixed(1)}`);
          return serve();
        });
      } else response = await serve();
    } catch (err) {
      response = await respondWithProblem(call, err);
    } finally {
      log(call, response?.status ?? 500);
    }
    return response;
  };
}
