/**
 * Domain errors thrown by services and the route wrapper, and their problem+json form
 * (RFC 9457). Handlers never build error responses by hand: they throw one of these.
 */

/** Problem types are relative URIs (RFC 9457 §3.1.1) served by this app as human-readable pages. */
export const PROBLEM_BASE = "/problems/";

export interface ProblemBody {
  type: string;
  title: string;
  status: number;
  detail: string;
  instance?: string;
  requestId?: string;
  [extension: string]: unknown;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly slug: string,
    readonly title: string,
    detail: string,
    readonly extensions: Record<string, unknown> = {},
    readonly headers: Record<string, string> = {},
  ) {
    super(detail);
  }

  toProblem(requestId?: string, instance?: string): ProblemBody {
    return {
      type: `${PROBLEM_BASE}${this.slug}`,
      title: this.title,
      status: this.status,
      detail: this.message,
      ...(instance ? { instance } : {}),
      ...(requestId ? { requestId: requestId } : {}),
      ...this.extensions,
    };
  }
}

export const badRequest = (detail: string, ext?: Record<string, unknown>) =>
  new ApiError(400, "bad-request", "The request is malformed", detail, ext);
export const invalidRequest = (
  detail: string,
  errors: { location: string; pointer: string; message: string }[],
  ext: Record<string, unknown> = {},
) => new ApiError(422, "invalid-request", "The request does not match the schema", detail, { errors, ...ext });
export const unauthorized = (detail: string) =>
  new ApiError(
    401,
    "unauthorized",
    "Authentication required",
    detail,
    {},
    { "WWW-Authenticate": 'Bearer realm="shearwire"' },
  );
export const forbidden = (detail: string, ext?: Record<string, unknown>) =>
  new ApiError(403, "insufficient-scope", "The API key lacks a scope this operation needs", detail, ext);
export const notFound = (what = "resource") =>
  new ApiError(404, "not-found", "Not found", `No ${what} with that id exists in this shop.`);
export const conflict = (detail: string, ext?: Record<string, unknown>) =>
  new ApiError(409, "conflict", "Conflict with the current state", detail, ext);
export const preconditionFailed = (detail: string, ext?: Record<string, unknown>) =>
  new ApiError(412, "precondition-failed", "The resource changed since you read it", detail, ext);
export const preconditionRequired = (detail: string) =>
  new ApiError(428, "precondition-required", "If-Match is required", detail);
export const payloadTooLarge = (limit: number) =>
  new ApiError(
    413,
    "payload-too-large",
    "The request body is too large",
    `Request bodies are limited to ${limit} bytes.`,
  );
export const unsupportedMediaType = () =>
  new ApiError(415, "unsupported-media-type", "Send JSON", "Request bodies must be application/json.");
export const tooManyRequests = (retryAfterS: number) =>
  new ApiError(
    429,
    "rate-limited",
    "Too many requests",
    `Slow down: try again in ${retryAfterS} s.`,
    {},
    { "Retry-After": String(retryAfterS) },
  );
export const internalError = () =>
  new ApiError(
    500,
    "internal",
    "Something went wrong on our side",
    "The error was logged; quote the request id if you contact support.",
  );
