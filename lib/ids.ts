import { randomFillSync } from "node:crypto";
import { monotonicFactory } from "ulidx";

/**
 * Public ids are a short prefix naming the kind of object, an underscore and a ULID:
 * sortable by creation time, unique without a database round trip, and safe in URLs.
 */
export const ID_PREFIXES = {
  shop: "shop",
  user: "usr",
  membership: "mem",
  shear: "shr",
  grade: "grd",
  apiKey: "key",
  program: "prg",
  event: "evt",
  request: "req",
  endpoint: "whe",
  delivery: "dlv",
  attempt: "att",
  invitation: "inv",
  plan: "pln",
  session: "ses",
  signInAttempt: "sia",
  stockItem: "stk",
  stockReservation: "srv",
} as const;

export type IdKind = keyof typeof ID_PREFIXES;

/**
 * The ULID's random characters come from the system's cryptographic generator, drawn a few
 * kilobytes at a time rather than one call per character (ulidx's default makes sixteen calls
 * per id, a measurable share of a request). Each byte is used once, as ulidx's default uses it.
 */
const pool = new Uint8Array(4096);
let next = pool.length;
function randomByte(): number {
  if (next === pool.length) {
    randomFillSync(pool);
    next = 0;
  }
  return pool[next++];
}

const ulid = monotonicFactory(() => randomByte() / 0xff);

export function newId(kind: IdKind): string {
  return `${ID_PREFIXES[kind]}_${ulid()}`;
}

const ULID = /^[0-9A-HJKMNP-TV-Z]{26}$/;

/** True when `id` looks like an id of that kind (used to answer 404 early for malformed ids). */
export function isId(kind: IdKind, id: string): boolean {
  const [prefix, rest] = id.split("_", 2);
  return prefix === ID_PREFIXES[kind] && rest !== undefined && ULID.test(rest);
}
