/**
 * The OpenAPI 3.1 document, generated from the same operations the route handlers run.
 */
import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import type { RouteConfig } from "@asteasolutions/zod-to-openapi";
import { ProblemSchema } from "../schemas/common";
import { EVENT_TYPES, EVENT_TYPE_WORDS } from "../schemas/enums";
import { WEBHOOK_ENVELOPES } from "../schemas/events";
import { exampleProgram, exampleProgramLayout, exampleShear, exampleWebhook } from "./examples";
import { VERSION } from "../version";
import { API_PREFIX, type Operation } from "./operation";

const ERROR_TEXT: Record<number, string> = {
  400: "The request is malformed (for example, the body is not JSON).",
  401: "No API key, or the key is unknown, revoked or expired.",
  403: "The API key lacks the scope this operation needs.",
  404: "Nothing with that id exists in this shop.",
  409: "The request conflicts with the current state.",
  412: "If-Match does not match the current revision.",
  413: "The body is larger than the limit.",
  415: "The body is not JSON.",
  422: "The request does not match the schema, or the Idempotency-Key was used for another request.",
  428: "If-Match is required.",
  429: "Rate limit exceeded; see Retry-After.",
  500: "Something went wrong on our side.",
  503: "The service cannot answer now; see Retry-After.",
};

const RATE_HEADERS = {
  "RateLimit-Policy": {
    description: "The key's quota and window (IETF RateLimit header fields).",
    schema: { type: "string" as const },
  },
  RateLimit: {
    description: "Requests left in the window and seconds until it resets.",
    schema: { type: "string" as const },
  },
};
const COMMON_HEADERS = {
  "X-Request-Id": {
    description: "This request's id; quote it when you ask for help.",
    schema: { type: "string" as const },
  },
};

/** The error statuses an operation can answer, from what it declares. */
export function errorStatuses(op: Operation): number[] {
  const codes = new Set<number>(op.errors ?? []);
  codes.add(500);
  if (op.scope) [401, 403, 429].forEach((c) => codes.add(c));
  if (op.params || op.query || op.body) codes.add(422);
  if (op.params && "id" in op.params.shape) codes.add(404);
  if (op.body) [400, 413, 415].forEach((c) => codes.add(c));
  if (op.method === "post" && op.scope) [409, 422].forEach((c) => codes.add(c));
  if (op.ifMatch) [412, 428].forEach((c) => codes.add(c));
  return [...codes].sort((a, b) => a - b);
}

const ERROR_NAMES: Record<number, string> = {
  400: "BadRequest",
  401: "Unauthorized",
  403: "Forbidden",
  404: "NotFound",
  409: "Conflict",
  412: "PreconditionFailed",
  413: "PayloadTooLarge",
  415: "UnsupportedMediaType",
  422: "UnprocessableContent",
  428: "PreconditionRequired",
  429: "TooManyRequests",
  500: "InternalError",
  503: "ServiceUnavailable",
};

/** The reference's opening page: what this is, the first calls, and the conventions. */
const QUICKSTART = `Push cut programs from your ERP, have them checked against the shear and the grade, release them to the machine-side gateway, and hear back through signed webhooks.

**Safety.** Computed settings are recommendations for a qualified operator, never a guarantee; the machine's manual, local codes and qualified people come first.

## Quickstart

Every call carries an API key of your shop: \`Authorization: Bearer swk_…\` (the console's **API keys** page makes one; \`npm run up\` prints a demo key with every scope). The examples use the demo shop, whose first shear is called *Bay 1 sheet shear*.

1. **See your shears.** \`GET /api/v1/shears\` lists them with their capacity, blade, backgauge and gap range. A program names its shear by id or by name.
2. **Check a program without storing it.** \`POST /api/v1/programs/validate\` with the example body (10 ga A36, two 120 × 48 in sheets ripped into strips and crosscut): the answer has 56 blanks from 62 strokes, the blade gap, rake, crown and hold-down with the reason for each, the force against the shear's rating and the cycle estimate. Findings carry a JSON \`pointer\` into your body.
3. **Store it.** \`POST /api/v1/programs\` with the same body and an \`Idempotency-Key\` (a retry with the same key answers the same). It is a \`draft\`. \`GET /api/v1/programs/{id}/layout\` places one sheet as it is cut, for drawing it.
4. **Release it.** \`POST /api/v1/programs/{id}/release\` with \`{}\` (or \`{"acknowledge": [codes]}\` when its check has warnings). The gateway beside the shear can now claim it.
5. **Hear back.** Add an endpoint with \`POST /api/v1/webhook-endpoints\` (\`{"url": "https://erp.example/hooks/shearwire"}\`); the answer holds its \`whsec_\` secret, once. Every change arrives as a signed POST: \`program.released\`, \`program.claimed\`, \`program.started\`, \`program.progressed\`, \`program.completed\` … (the **Webhooks** section lists every type with its body). \`POST /api/v1/webhook-endpoints/{id}/test\` sends a test event.
6. **Verify the signature** before trusting a delivery, with any Standard Webhooks library, for example in Node.js:

\`\`\`js
import { Webhook } from "standardwebhooks";
const wh = new Webhook(process.env.SHEARWIRE_WEBHOOK_SECRET.replace(/^whsec_/, ""));
// rawBody: the request body exactly as received (a string); headers: the request's headers
const event = wh.verify(rawBody, { "webhook-id": headers["webhook-id"], "webhook-timestamp": headers["webhook-timestamp"], "webhook-signature": headers["webhook-signature"] });
// de-duplicate on webhook-id: a delivery may come more than once
\`\`\`

Blanks rather than cut groups? \`POST /api/v1/plans\` lays them out on the sheets you have (it is computed by a worker: 202, then read the plan, or send \`Prefer: wait=10\`), and \`POST /api/v1/plans/{id}/programs\` writes the programs.

## Conventions

- Errors are \`application/problem+json\` (RFC 9457), each type explained at its \`type\` URL; schema errors list each problem with a JSON \`pointer\`.
- Every POST accepts an \`Idempotency-Key\`. Programs carry an \`ETag\`; changing one needs \`If-Match\`.
- Fields and query parameters are camelCase and carry their unit (\`bladeLengthMm\`, \`updatedSince\`). The one exception is the list envelope's \`next_cursor\`: lists answer \`{ "data": [...], "next_cursor": "…" | null }\`; pass it back as \`cursor\` for the next page (\`limit\` up to 200). Earlier snake_case spellings (\`updated_since\`, \`include_archived\`) are still accepted.
- Each key has a rate limit, announced in \`RateLimit-Policy\` and \`RateLimit\`; past it, 429 with \`Retry-After\`.`;

export function buildOpenApi(operations: Operation[], extra?: (registry: OpenAPIRegistry) => void) {
  const registry = new OpenAPIRegistry();
  const bearer = registry.registerComponent("securitySchemes", "apiKey", {
    type: "http",
    scheme: "bearer",
    description:
      "An API key of your shop: `Authorization: Bearer swk_…`. Create one in the console or with `npm run key:create`.",
  });
  registry.register("Problem", ProblemSchema);
  const headerRefs: Record<string, { $ref: string }> = {};
  for (const [name, spec] of Object.entries({
    ...COMMON_HEADERS,
    ...RATE_HEADERS,
    "Retry-After": { description: "Seconds to wait before retrying.", schema: { type: "integer" as const } },
  })) {
    headerRefs[name] = { $ref: `#/components/headers/${registry.registerComponent("headers", name, spec).name}` };
  }
  const pick = (names: string[]) => Object.fromEntries(names.map((n) => [n, headerRefs[n]]));
  const errorRef: Record<number, { $ref: string }> = {};
  for (const [status, name] of Object.entries(ERROR_NAMES)) {
    registry.registerComponent("responses", name, {
      description: ERROR_TEXT[Number(status)],
      headers: pick(
        Number(status) === 429
          ? ["X-Request-Id", "RateLimit-Policy", "RateLimit", "Retry-After"]
          : Number(status) === 503
            ? ["X-Request-Id", "Retry-After"]
            : ["X-Request-Id"],
      ),
      content: { "application/problem+json": { schema: { $ref: "#/components/schemas/Problem" } } },
    });
    errorRef[Number(status)] = { $ref: `#/components/responses/${name}` };
  }
  extra?.(registry);

  // Every event type as a webhook: the envelope the worker sends, from the same zod schema that types recordEvent.
  for (const type of EVENT_TYPES) {
    registry.registerWebhook({
      method: "post",
      path: type,
      operationId: `webhook_${type.replace(/\./g, "_")}`,
      summary: type,
      description: `${EVENT_TYPE_WORDS[type]}\n\nSent to every enabled endpoint that chose this type (or every type), signed per Standard Webhooks: \`webhook-id\` (the event's id, the same on every retry: de-duplicate on it), \`webhook-timestamp\` and \`webhook-signature\` (HMAC-SHA256 with the endpoint's \`whsec_\` secret). Answer any 2xx within 15 s; anything else is retried for about a day, and 410 Gone stops deliveries to the endpoint.`,
      tags: ["Webhooks"],
      request: {
        body: { content: { "application/json": { schema: WEBHOOK_ENVELOPES[type], example: exampleWebhook(type) } } },
      },
      responses: { 200: { description: "Any 2xx answer acknowledges the delivery." } },
    } as RouteConfig);
  }

  for (const op of operations) {
    const headers = pick(op.scope ? ["X-Request-Id", "RateLimit-Policy", "RateLimit"] : ["X-Request-Id"]);
    const responses: RouteConfig["responses"] = {};
    for (const [status, spec] of Object.entries(op.responses)) {
      responses[status] = {
        description: spec.description,
        headers: { ...headers, ...(spec.headers ?? {}) },
        ...(spec.schema ? { content: { "application/json": { schema: spec.schema } } } : {}),
      };
    }
    for (const status of errorStatuses(op)) responses[String(status)] ??= errorRef[status] as never;
    const requestHeaders = [];
    if (op.method === "post" && op.scope) {
      requestHeaders.push({
        name: "Idempotency-Key",
        in: "header" as const,
        required: false,
        description: "Makes a retry safe: the same key and body within 24 h return the first response.",
        schema: { type: "string" as const, maxLength: 255 },
      });
    }
    for (const header of op.requestHeaders ?? [])
      requestHeaders.push({ ...header, in: "header" as const, required: false });
    if (op.ifMatch) {
      requestHeaders.push({
        name: "If-Match",
        in: "header" as const,
        required: true,
        description: "The ETag of the revision you read; a stale one answers 412.",
        schema: { type: "string" as const },
      });
    }
    registry.registerPath({
      method: op.method,
      path: `${API_PREFIX}${op.path}`,
      operationId: op.operationId,
      summary: op.summary,
      description: op.description,
      tags: op.tags,
      security: op.scope ? [{ [bearer.name]: [op.scope] }] : [],
      request: {
        ...(op.params ? { params: op.params } : {}),
        ...(op.query ? { query: op.query } : {}),
        ...(op.body ? { body: { required: true, content: { "application/json": { schema: op.body } } } } : {}),
      },
      ...(requestHeaders.length ? { parameters: requestHeaders } : {}),
      responses,
      ...(op.scope ? { "x-required-scope": op.scope } : {}),
    } as RouteConfig);
  }

  const document = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Shearwire API",
      version: VERSION,
      description: QUICKSTART,
    },
    servers: [{ url: "/", description: "This server" }],
    tags: [
      { name: "Programs", description: "Cut programs: create, check, release, cancel." },
      {
        name: "Plans",
        description:
          "From order lines to cut programs: blanks planned onto the stock on hand in patterns the shear can cut, then written as draft programs.",
      },
      {
        name: "Stock",
        description:
          "Material on the racks: full sheets and remnants, adjusted with a reason, reserved for programs and given back.",
      },
      {
        name: "Gateway",
        description: "For the gateway beside each shear: claim released programs under a lease, report the run.",
      },
      {
        name: "Webhooks",
        description:
          "Endpoints that hear about every change, signed per Standard Webhooks; the events and each delivery attempt.",
      },
      { name: "Catalog", description: "Shears, grades, gauges and setup recommendations." },
      { name: "Settings", description: "The shop's settings: how work that names no shear is given one." },
      { name: "Meta", description: "Health, the OpenAPI document and the JSON Schema." },
    ],
  });
  // Realistic examples where a generated one would be dummy values: the demo shop's shear and the worked example, checked.
  const schemas = (document.components?.schemas ?? {}) as Record<string, { example?: unknown }>;
  if (schemas.Shear) schemas.Shear.example = exampleShear();
  if (schemas.Program) schemas.Program.example = exampleProgram();
  if (schemas.ProgramLayout) schemas.ProgramLayout.example = exampleProgramLayout();
  return document;
}
