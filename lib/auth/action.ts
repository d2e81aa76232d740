/**
 * The one wrapper every console server action goes through (next-safe-action): the person's
 * permission first (an expired session's redirect to sign-in passes through untouched), then
 * the one text rule of `lib/text.ts`, then the action's zod schema (the API's own schemas),
 * then the service. What reaches the browser is always meant for people: a refusal from a
 * service with its field errors, or, for anything unexpected, a plain message with a
 * reference that is logged with the error. Never a database message, never a secret.
 */
import { createSafeActionClient } from "next-safe-action";
import { ApiError } from "../errors";
import { requestEm } from "../db/orm";
import { newId } from "../ids";
import { findUnsafeText } from "../text";
import { can, type Permission } from "./roles";
import { currentMember, NotAllowedError } from "./session";

/** What a refused or failed action tells the person. */
export interface ActionProblem {
  message: string;
  /** field name (dotted path) → what is wrong with it */
  fieldErrors?: Record<string, string>;
  /** the logged error's reference, for an unexpected failure */
  reference?: string;
}

/** A service refusal's pointers (`/url`, `/blanks/2/length`) as form field names (`url`, `blanks.2.length`). */
function fieldErrorsOf(error: ApiError): Record<string, string> | undefined {
  const list = error.extensions.errors as { pointer: string; message: string }[] | undefined;
  if (!list?.length) return undefined;
  return Object.fromEntries(list.map((e) => [e.pointer.replace(/^\//, "").replace(/\//g, "."), e.message]));
}

export function problemOf(error: unknown): ActionProblem {
  if (error instanceof ApiError && error.status < 500)
    return { message: error.message, fieldErrors: fieldErrorsOf(error) };
  if (error instanceof NotAllowedError) return { message: error.message };
  const reference = newId("request");
  console.error(`[console] ${reference}:`, error);
  return {
    message: `Something went wrong on our side and nothing was changed by it. Quote ${reference} if you ask for help.`,
    reference,
  };
}

/** Form fields (and any plain object) as values the text rule can walk; a file counts by its name. */
function valuesOf(input: unknown): unknown {
  if (typeof FormData !== "undefined" && input instanceof FormData) {
    const values: Record<string, string[]> = {};
    for (const [name, value] of input.entries())
      (values[name] ??= []).push(typeof value === "string" ? value : value.name);
    return Object.fromEntries(Object.entries(values).map(([name, list]) => [name, list.length === 1 ? list[0] : list]));
  }
  return input;
}

function refuseUnsafeText(input: unknown) {
  const bad = findUnsafeText(valuesOf(input));
  if (bad) {
    const field = bad.pointer.replace(/^\//, "").split("/")[0] || "form";
    throw new ApiError(422, "invalid-request", "The request does not match the schema", `${field} ${bad.message}.`, {
      errors: [{ location: "body", pointer: `/${field}`, message: bad.message }],
    });
  }
}

const client = createSafeActionClient({
  defaultValidationErrorsShape: "flattened",
  handleServerError: (error): ActionProblem => problemOf(error),
});

/** Actions anyone may call (accepting an invitation): the text rule, the schema, errors as above. */
export const publicAction = client.use(async ({ next, clientInput }) => {
  refuseUnsafeText(clientInput);
  return next({ ctx: { em: await requestEm() } });
});

/** Actions of a signed-in member whose role allows `permission`; the member and an entity manager come in `ctx`. */
export function memberAction(permission: Permission) {
  return client.use(async ({ next, clientInput }) => {
    const member = await currentMember(); // redirects to sign-in when the session is gone
    if (!can(member.role, permission)) throw new NotAllowedError(`Your role (${member.role}) may not do this.`);
    refuseUnsafeText(clientInput);
    return next({ ctx: { member, em: await requestEm() } });
  });
}
