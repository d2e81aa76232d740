/** Reading a request's input: the body within its size limit, the query, and zod's errors as problem+json pointers. */
import type { z } from "zod";
import { findUnsafeText } from "../text";
import { badRequest, invalidRequest, payloadTooLarge } from "../errors";
import type { Infer } from "./operation";

export const MAX_BODY_BYTES = Number(process.env.SHEARWIRE_MAX_BODY_BYTES ?? 1_048_576);
export type Location = "body" | "query" | "path" | "header";

const escapePointer = (s: string | number | symbol) => String(s).replace(/~/g, "~0").replace(/\//g, "~1");

export function zodErrors(location: Location, error: z.ZodError) {
  return error.issues.map((issue) => ({
    location,
    pointer: issue.path.length ? `/${issue.path.map(escapePointer).join("/")}` : "",
    message: issue.message,
  }));
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/** Refuse text that cannot be stored (NUL, broken Unicode) before any schema or service sees it. */
function refuseUnsafeText(value: unknown, location: Exclude<Location, "header">) {
  const bad = findUnsafeText(value);
  if (bad) {
    const where = bad.pointer || "(root)";
    throw invalidRequest(`The ${location} ${where} ${bad.message}.`, [
      { location, pointer: bad.pointer, message: bad.message },
    ]);
  }
}

/**
 * True when JSON text read as valid UTF-8 cannot hold unsafe text: such text can only come from
 * a `\u` escape (UTF-8 has no lone surrogates, and JSON allows no raw NUL), so without one the
 * walk over every string and key is not needed.
 */
export const plainJsonText = (text: string) => !text.includes("\\u") && !text.includes("\u0000");

export function parse<T extends z.ZodType | undefined>(
  schema: T | undefined,
  value: unknown,
  location: "body" | "query" | "path",
  { textChecked = false } = {},
): Infer<T> {
  if (!schema) return undefined as Infer<T>;
  if (!textChecked) refuseUnsafeText(value, location);
  const result = schema.safeParse(value);
  if (!result.success) {
    const errors = zodErrors(location, result.error);
    throw invalidRequest(
      `The ${location} has ${plural(errors.length, "problem")}: ${errors.map((e) => `${e.pointer || "(root)"} ${e.message}`).join("; ")}.`,
      errors,
    );
  }
  return result.data as Infer<T>;
}

/** Read the body as UTF-8, stopping as soon as it passes the limit (a chunked body is never read whole first). */
export async function readBody(request: Request, limit = MAX_BODY_BYTES): Promise<string> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > limit) throw payloadTooLarge(limit);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw payloadTooLarge(limit);
    }
    chunks.push(value);
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(Buffer.concat(chunks));
  } catch {
    throw badRequest("The body is not valid UTF-8.");
  }
}

export function queryObject(url: URL): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [key, value] of url.searchParams) {
    const prev = out[key];
    out[key] = prev === undefined ? value : Array.isArray(prev) ? [...prev, value] : [prev, value];
  }
  return out;
}
