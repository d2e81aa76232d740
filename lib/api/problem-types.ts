/** Every problem type the API answers with, for the human-readable pages at /problems/{slug}. */
export const PROBLEM_TYPES: Record<string, { status: number; title: string; explanation: string }> = {
  "bad-request": {
    status: 400,
    title: "The request is malformed",
    explanation: "The body is not valid JSON or not UTF-8, or a cursor was not one the API gave out.",
  },
  "bad-idempotency-key": {
    status: 400,
    title: "Idempotency-Key is malformed",
    explanation: "Use 1 to 255 visible ASCII characters; a UUID is a good choice.",
  },
  unauthorized: {
    status: 401,
    title: "Authentication required",
    explanation:
      "Send an API key of your shop as `Authorization: Bearer swk_…`. Revoked and expired keys are refused on the next request.",
  },
  "insufficient-scope": {
    status: 403,
    title: "The API key lacks a scope",
    explanation: "The operation names the scope it needs (`requiredScope`); create a key that has it.",
  },
  "not-found": {
    status: 404,
    title: "Not found",
    explanation: "Nothing with that id exists in your shop. Objects of other shops are never visible.",
  },
  conflict: {
    status: 409,
    title: "Conflict with the current state",
    explanation:
      "For example a program whose reference is taken (`existingId` names it), a transition the program's state does not allow (`currentStatus`), or a request that is still running under the same Idempotency-Key.",
  },
  "program-not-releasable": {
    status: 409,
    title: "The program has errors",
    explanation:
      "The program's check has findings of severity `error`; they are listed with JSON pointers into the program. Fix them with PATCH and release again.",
  },
  "warnings-not-acknowledged": {
    status: 409,
    title: "Acknowledge the warnings to release",
    explanation: "The program's check has warnings. Read them, then release again with their codes in `acknowledge`.",
  },
  "no-shear-can-cut": {
    status: 422,
    title: "No shear of the shop can cut this",
    explanation:
      "The program or plan named no shear, and none of the shop's active shears can cut it. `shears` lists each one with its reason (its check's errors, or the planner's limits); name a shear to see its full check, or change the program.",
  },
  "stock-not-available": {
    status: 409,
    title: "Not enough stock available",
    explanation:
      "Fewer sheets of the stock item are free (on hand less reserved) than asked, or it is archived. `available` says how many are free; another reservation may have taken them a moment earlier.",
  },
  "precondition-failed": {
    status: 412,
    title: "The resource changed since you read it",
    explanation: "Your If-Match names an older revision. Read the program again and retry.",
  },
  "unknown-path": {
    status: 404,
    title: "No such path in the API",
    explanation:
      "No operation of API v1 has that path (check its spelling and letter case); the OpenAPI document at `/api/v1/openapi.json` lists every path and its methods.",
  },
  "method-not-allowed": {
    status: 405,
    title: "Method not allowed",
    explanation:
      "The path exists, but not with that HTTP method; `Allow` lists the methods it takes. TRACE and other diagnostic methods are never served.",
  },
  "payload-too-large": {
    status: 413,
    title: "The request body is too large",
    explanation: "Bodies are limited to 1 MiB.",
  },
  "unsupported-media-type": {
    status: 415,
    title: "Send JSON",
    explanation: "Request bodies must be `application/json`.",
  },
  "invalid-request": {
    status: 422,
    title: "The request does not match the schema",
    explanation:
      "`errors` lists each problem with its location (body, query, path) and a JSON pointer. Text holding a NUL character (U+0000) or broken Unicode (an unpaired UTF-16 surrogate) is refused here too, wherever it is sent, because it cannot be stored. A plan outside the planner's limits names the limit (`limit`), the value sent (`value`) and the most allowed (`max`).",
  },
  "idempotency-key-reused": {
    status: 422,
    title: "Idempotency-Key reused with another request",
    explanation: "An Idempotency-Key stands for one request for 24 hours; a new request needs a new key.",
  },
  "precondition-required": {
    status: 428,
    title: "If-Match is required",
    explanation:
      "Changing a program needs If-Match with the ETag you read, so two editors cannot overwrite each other.",
  },
  "rate-limited": {
    status: 429,
    title: "Too many requests",
    explanation:
      "Each key has a budget per minute, announced in the `RateLimit-Policy` and `RateLimit` headers. Wait `Retry-After` seconds.",
  },
  "plan-failed": {
    status: 422,
    title: "The plan could not be computed",
    explanation:
      "A preview ran into the planner's time or memory limit, or the planner stopped; the detail says which. Plan fewer blank types or pieces at once, or coarser sizes.",
  },
  "planning-unavailable": {
    status: 503,
    title: "No planner answered in time",
    explanation:
      "Previews are computed by the planning workers while you wait; none answered in time. Store the plan instead (POST /plans) and read it when it is done, or retry after `Retry-After` seconds.",
  },
  internal: {
    status: 500,
    title: "Something went wrong on our side",
    explanation: "The error was logged with the request id. Retrying with the same Idempotency-Key is safe.",
  },
};
