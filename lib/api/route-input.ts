/** Reading a request's input: the body within its size limit, the query, and zod's errors as problem+json pointers. */
import type { z } from "zod";
import { findUnsafeText } from "../text";
import { badRequest, invalidRequest, payloadTooLarge } from "../errors";
import type { Infer } from "./operation";

export const MAX_BODY_BYTES = Number(process.env.SHEARWIRE_MAX_BODY_BYTES ?? 1_048_576);
export type Location = "body" | "query" | "path" | "header";

const escapePointer = (s: string | number | symbol) => String(s).replace(/~/g, "~0").replace(/\//g, "~1");

const pointerOf = (path: PropertyKey[]) => (path.length ? `/${path.map(escapePointer).join("/")}` : "");

/** zod's issue for a key the value lacks (an `invalid_type` that received nothing). */
const missingKey = (issue: z.core.$ZodIssue) =>
  issue.code === "invalid_type" && issue.path.length > 0 && issue.message.endsWith("received undefined");

/** An issue that says the value has another shape than a form of a union asks for: wrong as a whole, or lacking a key. */
const structural = (issue: z.core.$ZodIssue) => issue.path.length === 0 || missingKey(issue);

/** One form of a union, as what the value lacks or has too much of for it (`"value" required, unknown "mm"`). */
function describeForm(issues: z.core.$ZodIssue[]): string {
  return issues
    .map((issue) => {
      if (issue.code === "unrecognized_keys") return `unknown ${issue.keys.map((key) => `"${key}"`).join(", ")}`;
      if (missingKey(issue)) return `"${issue.path.map(String).join("/")}" required`;
      return `${pointerOf(issue.path)}${issue.path.length ? " " : ""}${issue.message}`;
    })
    .join(", ");
}

/**
 * zod's issues as problem+json errors. A value that fits none of a union's forms says more than zod's
 * "Invalid input": when one form fits its shape, that form's own issues (a gauge that is not whole); when
 * none does, what each form lacks or does not know.
 */
function flatten(issue: z.core.$ZodIssue, prefix: PropertyKey[]): { pointer: string; message: string }[] {
  const path = [...prefix, ...issue.path];
  if (issue.code !== "invalid_union" || !issue.errors?.length)
    return [{ pointer: pointerOf(path), message: issue.message }];
  const fitting = issue.errors.filter((form) => form.length > 0 && !form.some(structural));
  if (fitting.length === 1) return fitting[0].flatMap((inner) => flatten(inner, path));
  const forms = [...new Set(issue.errors.map(describeForm))];
  const message =
    forms.length === 1
      ? forms[0]
      : `fits none of its ${forms.length} accepted forms: ${forms.map((form, index) => `(${index + 1}) ${form}`).join("; ")}`;
  return [{ pointer: pointerOf(path), message }];
}

export function zodErrors(location: Location, error: z.ZodError) {
  return error.issues.flatMap((issue) => flatten(issue, []).map((one) => ({ location, ...one })));
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
