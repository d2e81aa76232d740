/**
 * Validates real responses against the committed OpenAPI document with Ajv (JSON Schema
 * 2020-12, the dialect of OpenAPI 3.1), and records which operations were exercised.
 */
import { readFileSync } from "node:fs";
import Ajv2020 from "ajv/dist/2020.js";
import addFormats from "ajv-formats";
import { expect } from "vitest";
import type { Operation } from "../../lib/api/operation";

const DOC_ID = "https://shearwire.test/openapi.json";
export const doc = JSON.parse(readFileSync("openapi/openapi.json", "utf8"));

const ajv = new Ajv2020({ strict: false, allErrors: true, validateFormats: true });
addFormats.default(ajv);
ajv.addSchema({ $id: DOC_ID, components: doc.components });

const cache = new Map<string, ReturnType<typeof ajv.compile>>();
function compiled(schema: unknown) {
  const key = JSON.stringify(schema);
  let v = cache.get(key);
  if (!v) {
    v = ajv.compile(rewrite(schema));
    cache.set(key, v);
  }
  return v;
}

export const exercised = new Set<string>();

interface Res {
  status: number;
  headers: Record<string, string>;
  body: unknown;
  text?: string;
}

/** Assert that the response's status, content type and body are what the document says. */
export function expectDocumented(op: Operation, res: Res) {
  const path = `/api/v1${op.path}`;
  const operation = doc.paths[path]?.[op.method];
  expect(operation, `${op.method} ${path} is in the document`).toBeDefined();
  let response = operation.responses[String(res.status)];
  expect(response, `${op.operationId} documents status ${res.status}`).toBeDefined();
  if (response.$ref) response = doc.components.responses[response.$ref.split("/").pop()];
  const content = response.content as Record<string, { schema: unknown }> | undefined;
  if (!content) {
    expect(res.text ?? "").toBe("");
  } else {
    const type = (res.headers["content-type"] ?? "").split(";")[0];
    expect(Object.keys(content), `${op.operationId} ${res.status} content type`).toContain(type);
    const schema = content[type].schema as Record<string, unknown>;
    const validate = compiled(schema);
    const ok = validate(res.body);
    expect(ok, `${op.operationId} ${res.status} body matches the document: ${ajv.errorsText(validate.errors)}`).toBe(
      true,
    );
  }
  exercised.add(op.operationId);
}

/** Assert that a delivered webhook body is what the document's `webhooks` section says for its type. */
export function expectDocumentedWebhook(payload: { type: string }) {
  const hook = doc.webhooks?.[payload.type]?.post;
  expect(hook, `webhook ${payload.type} is in the document`).toBeDefined();
  const validate = compiled(hook.requestBody.content["application/json"].schema);
  const ok = validate(payload);
  expect(ok, `${payload.type} matches the document: ${ajv.errorsText(validate.errors)}`).toBe(true);
}

/** Point local refs (#/components/...) at the document registered in Ajv. */
function rewrite(schema: unknown): Record<string, unknown> {
  return JSON.parse(JSON.stringify(schema).replace(/"\$ref":"#\//g, `"$ref":"${DOC_ID}#/`));
}
