/**
 * Hostile input on every operation: generated bodies, queries and path ids carrying NUL
 * characters, unpaired UTF-16 surrogates, very long strings, deep nesting and huge numbers.
 * The server must never answer 5xx, every refusal is problem+json, and a refused request
 * stores nothing (the shop's row counts are the same before and after it).
 */
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { operations } from "../../lib/api/operations";
import type { Operation } from "../../lib/api/operation";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  examplePlan,
  exampleProgram,
  keyFor,
  TEST_SHEAR,
  testOrm,
  type TestShop,
} from "../support/fixtures";
import { startReceiver, type Receiver } from "../support/receiver";

let shop: TestShop;
let key: string;
let receiver: Receiver;
const ids: Record<string, string> = {};

/** Strings no database column can hold, and other trouble. */
const HOSTILE_STRINGS = [
  "\u0000",
  "a\u0000b",
  "\u0000".repeat(50),
  "\ud800",
  "x\udfffy",
  "\udc00\ud800",
  "🙂\ud83d",
  "\ud83d" + "x".repeat(300),
  "x".repeat(300),
  "y".repeat(5_000),
  "z".repeat(120_000),
  "'; drop table programs; --",
  "../../etc/passwd",
  "%00",
  "\u202e\u0000",
];
const HOSTILE_NUMBERS = [1e308, -1e308, 2 ** 53 + 1, -(2 ** 63), 1e-320, 4_294_967_296, 9_007_199_254_740_991];

function deep(levels: number, leaf: unknown = "\u0000"): unknown {
  let value: unknown = leaf;
  for (let i = 0; i < levels; i++) value = i % 2 ? [value] : { k: value };
  return value;
}

const hostileValue = fc.oneof(
  fc.constantFrom(...HOSTILE_STRINGS),
  fc.constantFrom(...HOSTILE_NUMBERS),
  fc.constantFrom(
    deep(40),
    deep(3_000),
    Array.from({ length: 20_000 }, () => 1),
    { "\u0000": 1 },
    { "\ud800key": "v" },
  ),
  fc.string({ unit: "binary", maxLength: 30 }).map((s) => `${s}\u0000${s}`),
  fc.string({ unit: "binary", maxLength: 30 }).map((s) => `${s}\udbff`),
);

/** A valid body for each operation, to break in one place at a time. */
function baseBody(op: Operation): unknown {
  switch (op.operationId) {
    case "createProgram":
    case "validateProgram":
      return exampleProgram(shop.shearId);
    case "updateProgram":
      return { title: "t", metadata: { line: "1" } };
    case "releaseProgram":
      return { acknowledge: [] };
    case "cancelProgram":
      return { reason: "r" };
    case "createPlan":
    case "previewPlan":
      return examplePlan(shop.shearId);
    case "writePlanPrograms":
      return { referencePrefix: "P", metadata: { a: "b" } };
    case "claimProgram":
      return { waitSeconds: 0, leaseSeconds: 600 };
    case "heartbeatProgram":
      return {};
    case "reportProgress":
      return { groupsDone: 1, strokesDone: 1 };
    case "completeProgram":
      return { goodPieces: 1 };
    case "failProgram":
      return { reason: "other", message: "m" };
    case "createWebhookEndpoint":
      return { url: receiver.url, description: "d" };
    case "updateWebhookEndpoint":
      return { description: "d" };
    case "rotateWebhookSecret":
      return { overlapHours: 1 };
    case "resendEvent":
      return { endpoint: ids.endpoint };
    case "createShear":
      return { ...TEST_SHEAR, name: "s" };
    case "updateShear":
      return { strokesPerMin: 25 };
    case "createGrade":
      return { code: "G1", name: "g", family: "carbon-steel", standard: "s", yieldMpa: 250, tensileMinMpa: 400 };
    case "updateGrade":
      return { name: "g" };
    case "createStockItem":
      return {
        kind: "sheet",
        grade: "A36",
        thicknessMm: 3,
        lengthMm: 2500,
        widthMm: 1250,
        quantity: 4,
        location: "R1",
      };
    case "adjustStock":
      return { delta: 1, reason: "counted" };
    case "reserveStock":
      return { quantity: 1, note: "n" };
    case "setupRecommendation":
      return { shear: shop.shearId, grade: "A36", thickness: { value: 3 }, units: "mm" };
    default:
      return {};
  }
}

/** Every path to a leaf of a JSON value. */
function leafPaths(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.length ? value.flatMap((v, i) => leafPaths(v, [...path, i])) : [path];
  if (value && typeof value === "object") {
    const entries = Object.entries(value);
    return entries.length ? entries.flatMap(([k, v]) => leafPaths(v, [...path, k])) : [path];
  }
  return [path];
}

function setAt(root: unknown, path: (string | number)[], value: unknown): unknown {
  if (!path.length) return value;
  const copy = structuredClone(root) as Record<string | number, unknown>;
  let node = copy;
  for (const step of path.slice(0, -1)) node = node[step] as Record<string | number, unknown>;
  node[path[path.length - 1]] = value;
  return copy;
}

const idFor = (op: Operation) => {
  if (op.path.startsWith("/programs")) return ids.program;
  if (op.path.startsWith("/plans")) return ids.plan;
  if (op.path.startsWith("/webhook-endpoints")) return ids.endpoint;
  if (op.path.startsWith("/events")) return ids.event;
  if (op.path.startsWith("/shears")) return ids.shear;
  if (op.path.startsWith("/grades")) return ids.grade;
  if (op.path.startsWith("/stock-reservations")) return ids.reservation;
  if (op.path.startsWith("/stock")) return ids.stock;
  return "x";
};

const HOSTILE_IDS = [
  "%00",
  "prg_%00",
  "a%00b",
  "%ED%A0%80",
  "%FF%FE",
  "x".repeat(3_000),
  "%F0%9F%99%82",
  "..%2F..%2Fetc",
  "%E2%80%AE",
];

type Case =
  | { kind: "body"; where: number; value: unknown }
  | { kind: "extra"; key: string; value: unknown }
  | { kind: "whole"; value: unknown }
  | { kind: "query"; name: string; value: unknown }
  | { kind: "id"; value: string };

function caseFor(op: Operation): fc.Arbitrary<Case> {
  const options: fc.Arbitrary<Case>[] = [];
  if (op.body) {
    options.push(
      fc.record({ kind: fc.constant("body" as const), where: fc.nat(), value: hostileValue }),
      fc.record({
        kind: fc.constant("extra" as const),
        key: fc.constantFrom("metadata", "note", "\u0000", "\udc00", "x".repeat(2_000)),
        value: hostileValue,
      }),
      fc.record({ kind: fc.constant("whole" as const), value: hostileValue }),
    );
  }
  // every operation gets a query string: one that takes none must ignore it or refuse it cleanly
  const names = [...Object.keys(op.query?.shape ?? {}), "cursor", "unknown\u0000"];
  options.push(
    fc.record({ kind: fc.constant("query" as const), name: fc.constantFrom(...names), value: hostileValue }),
  );
  if (op.params) options.push(fc.record({ kind: fc.constant("id" as const), value: fc.constantFrom(...HOSTILE_IDS) }));
  return fc.oneof(...options);
}

function requestFor(op: Operation, c: Case): { url: string; init: RequestInit } {
  let path = op.path.replace("{id}", encodeURIComponent(idFor(op)));
  if (c.kind === "id") path = op.path.replace("{id}", c.value);
  const url = new URL(`${BASE_URL}/api/v1${path}`);
  // (a URL has room for about 16 KB with its headers: longer ones are cut, as any HTTP server refuses them before the app)
  if (c.kind === "query")
    url.searchParams.set(c.name, (typeof c.value === "string" ? c.value : JSON.stringify(c.value)).slice(0, 4_000));
  const headers: Record<string, string> = { Authorization: `Bearer ${key}` };
  if (op.ifMatch) headers["If-Match"] = "*";
  let body: string | undefined;
  if (op.body) {
    let value = baseBody(op);
    if (c.kind === "body") {
      const paths = leafPaths(value).filter((p) => !(op.operationId === "claimProgram" && p[0] === "waitSeconds")); // never a real long poll
      value = setAt(value, paths[c.where % paths.length] ?? [], c.value);
    } else if (c.kind === "extra") value = { ...(value as object), [c.key]: c.value };
    else if (c.kind === "whole") value = c.value;
    body = JSON.stringify(value); // lone surrogates travel as \udXXX escapes, as any JSON client would send them
    headers["Content-Type"] = "application/json";
  }
  return { url: url.toString(), init: { method: op.method.toUpperCase(), headers, body } };
}

/** The shop's rows in every table a request writes to (deliveries and plan events are left out: the worker writes those, in its own time). */
async function rowCounts(): Promise<Record<string, number>> {
  const [row] = await (
    await testOrm()
  ).em
    .fork()
    .getConnection()
    .execute<Record<string, string>[]>(
      `select (select count(*) from programs where shop_id = ?) as programs, (select count(*) from plans where shop_id = ?) as plans,
            (select count(*) from events where shop_id = ? and type not like 'plan.%') as events, (select count(*) from webhook_endpoints where shop_id = ?) as endpoints,
            (select count(*) from shears where shop_id = ?) as shears,
            (select count(*) from grades where shop_id = ?) as grades, (select count(*) from api_keys where shop_id = ?) as keys,
            (select coalesce(sum(revision), 0) from programs where shop_id = ?) as revisions,
            (select count(*) from shears where shop_id = ? and archived_at is not null) as archived,
            (select count(*) from stock_items where shop_id = ?) as stock, (select coalesce(sum(quantity * 1000 + reserved), 0) from stock_items where shop_id = ?) as sheets,
            (select count(*) from stock_reservations where shop_id = ? and status = 'open') as reservations`,
      Array(12).fill(shop.shopId),
    );
  return Object.fromEntries(Object.entries(row).map(([k, v]) => [k, Number(v)]));
}

beforeAll(async () => {
  shop = await createTestShop("hostile");
  key = (
    await keyFor(
      shop.shopId,
      [
        "programs:read",
        "programs:write",
        "programs:release",
        "gateway",
        "catalog:read",
        "catalog:write",
        "events:read",
        "webhooks:write",
        "settings:write",
        "stock:read",
        "stock:write",
      ],
      { rateLimitPerMin: 1_000_000 },
    )
  ).secret;
  receiver = await startReceiver();
  const call = async (method: string, path: string, body?: unknown) => {
    const res = await fetch(`${BASE_URL}/api/v1${path}`, {
      method,
      headers: { Authorization: `Bearer ${key}`, "Content-Type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    return res.json();
  };
  ids.shear = shop.shearId;
  ids.program = (await call("POST", "/programs", exampleProgram(shop.shearId))).id;
  ids.plan = (await call("POST", "/plans", examplePlan(shop.shearId))).id;
  ids.endpoint = (await call("POST", "/webhook-endpoints", { url: receiver.url })).endpoint.id;
  ids.event = (await call("GET", `/events?subject=${ids.program}`)).data[0].id;
  ids.grade = (await call("GET", "/grades?limit=1")).data[0].id;
  ids.stock = (await call("POST", "/stock", baseBody({ operationId: "createStockItem" } as Operation))).id;
  ids.reservation = (await call("POST", `/stock/${ids.stock}/reservations`, { quantity: 1 })).id;
});
afterAll(async () => {
  await receiver?.close();
  await closeTestOrm();
});

describe("hostile input on every operation", () => {
  const keyed = operations.filter((op) => op.scope !== null);
  let sent = 0;

  it.each(keyed.map((op) => [`${op.method.toUpperCase()} ${op.path}`, op] as const))(
    "%s: never 5xx, refusals store nothing",
    async (_name, op) => {
      const write = op.method !== "get";
      await fc.assert(
        fc.asyncProperty(caseFor(op), async (c) => {
          const { url, init } = requestFor(op, c);
          const before = write ? await rowCounts() : null;
          const res = await fetch(url, init);
          const text = await res.text();
          sent += 1;
          expect(
            res.status,
            `${init.method} ${url.slice(0, 200)} answered ${res.status}: ${text.slice(0, 300)}`,
          ).toBeLessThan(500);
          if (res.status >= 400) {
            expect(res.headers.get("content-type")).toMatch(/application\/problem\+json/);
            expect(text).not.toMatch(/insert into|update "|select .* from|syntax error|invalid message format/i);
            if (before) expect(await rowCounts()).toEqual(before);
          }
        }),
        { numRuns: 52, seed: 20261202 },
      );
    },
  );

  it("sent at least 2,000 requests in all", () => {
    expect(sent).toBeGreaterThanOrEqual(2_000);
  });
});
