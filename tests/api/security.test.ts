/**
 * Authentication, scopes and tenancy on every authenticated operation: no key → 401, a
 * revoked or expired key → 401, a key without the scope → 403, another shop's object → 404
 * (never 403, never its details). Responses are checked against the OpenAPI document.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SCOPES } from "../../lib/schemas/enums";
import type { Operation } from "../../lib/api/operation";
import { operations } from "../../lib/api/operations";
import { revokeKey } from "../../lib/services/keys";
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
import { expectDocumented } from "../support/openapi";

let mine: TestShop;
let theirs: TestShop;
/** ids of objects in `theirs`, by the resource an operation's {id} names */
const foreign: Record<string, string> = {};

const secured = operations.filter((o) => o.scope !== null);

/** A request body that passes validation for each operation that takes one. */
function bodyFor(op: Operation): object | undefined {
  if (!op.body) return undefined;
  switch (op.operationId) {
    case "createProgram":
    case "validateProgram":
      return exampleProgram(mine.shearId);
    case "createProgramBatch":
      return { programs: [exampleProgram(mine.shearId)] };
    case "createPlan":
    case "previewPlan":
      return examplePlan(mine.shearId);
    case "writePlanPrograms":
      return {};
    case "updateProgram":
      return { title: "changed" };
    case "releaseProgram":
      return { acknowledge: [] };
    case "cancelProgram":
      return { reason: "test" };
    case "createShear":
      return { ...TEST_SHEAR, name: `Shear ${Math.random()}` };
    case "updateShear":
      return { strokesPerMin: 20 };
    case "createGrade":
      return {
        code: `G${Date.now()}${Math.floor(Math.random() * 1000)}`,
        name: "x",
        family: "carbon-steel",
        standard: "test",
        yieldMpa: 250,
        tensileMinMpa: 400,
      };
    case "updateGrade":
      return { note: "changed" };
    case "recommendSetup":
      return { shear: mine.shearId, grade: "A36", thickness: { value: 2 }, units: "mm" };
    case "claimProgram":
      return { waitSeconds: 0 };
    case "heartbeatProgram":
    case "rotateWebhookSecret":
      return {};
    case "reportProgress":
      return { groupsDone: 1, strokesDone: 1 };
    case "completeProgram":
      return { goodPieces: 1 };
    case "failProgram":
      return { reason: "other" };
    case "createWebhookEndpoint":
      return { url: "http://127.0.0.1:9/hook" };
    case "updateWebhookEndpoint":
      return { description: "changed" };
    case "createStockItem":
      return { kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 2500, widthMm: 1250, quantity: 4 };
    case "adjustStock":
      return { delta: 1, reason: "counted" };
    case "reserveStock":
      return { quantity: 1 };
    case "updateSettings":
      return { routingRule: "least_capacity" };
    case "resendEvent":
      return { endpoint: foreign.whe };
    default:
      throw new Error(`no sample body for ${op.operationId}`);
  }
}

function pathFor(op: Operation, id?: string) {
  return `/api/v1${op.path.replace("{id}", id ?? "none")}`;
}

function call(op: Operation, path: string, key?: string) {
  let req = request(BASE_URL)[op.method](path);
  if (key) req = req.set("Authorization", `Bearer ${key}`);
  if (op.ifMatch) req = req.set("If-Match", '"1"');
  const body = bodyFor(op);
  return body ? req.send(body) : req;
}

beforeAll(async () => {
  mine = await createTestShop("mine");
  theirs = await createTestShop("theirs");
  const post = (path: string, body: object) =>
    request(BASE_URL).post(path).set("Authorization", `Bearer ${theirs.key}`).send(body).expect(201);
  foreign.prg = (await post("/api/v1/programs", exampleProgram(theirs.shearId))).body.id;
  foreign.shr = theirs.shearId;
  foreign.pln = (
    await request(BASE_URL)
      .post("/api/v1/plans")
      .set("Authorization", `Bearer ${theirs.key}`)
      .send(examplePlan(theirs.shearId))
      .expect(202)
  ).body.id;
  const grades = await request(BASE_URL)
    .get("/api/v1/grades?limit=1")
    .set("Authorization", `Bearer ${theirs.key}`)
    .expect(200);
  foreign.grd = grades.body.data[0].id;
  foreign.whe = (await post("/api/v1/webhook-endpoints", { url: "http://127.0.0.1:9/theirs" })).body.endpoint.id;
  const events = await request(BASE_URL)
    .get("/api/v1/events?limit=1")
    .set("Authorization", `Bearer ${theirs.key}`)
    .expect(200);
  foreign.evt = events.body.data[0].id;
  foreign.stk = (
    await post("/api/v1/stock", {
      kind: "sheet",
      grade: "A36",
      thicknessMm: 3,
      lengthMm: 2500,
      widthMm: 1250,
      quantity: 4,
    })
  ).body.id;
  foreign.srv = (await post(`/api/v1/stock/${foreign.stk}/reservations`, { quantity: 1 })).body.id;
});
afterAll(closeTestOrm);

describe.each(secured.map((op) => [op.operationId, op] as const))("%s", (_name, op) => {
  it("refuses a request without a key (401)", async () => {
    const res = await call(op, pathFor(op, foreign.prg));
    expectDocumented(op, res);
    expect(res.status).toBe(401);
    expect(res.headers["www-authenticate"]).toMatch(/^Bearer/);
  });

  it(`refuses a key without ${op.scope} (403)`, async () => {
    const others = SCOPES.filter((s) => s !== op.scope);
    const { secret } = await keyFor(mine.shopId, others);
    const res = await call(op, pathFor(op, foreign.prg), secret);
    expectDocumented(op, res);
    expect(res.status).toBe(403);
    expect(res.body.requiredScope).toBe(op.scope);
  });

  if (op.path.includes("{id}")) {
    it("answers 404 for another shop's object, saying nothing about it", async () => {
      const prefixes: [string, string][] = [
        ["/programs", "prg"],
        ["/plans", "pln"],
        ["/shears", "shr"],
        ["/grades", "grd"],
        ["/webhook-endpoints", "whe"],
        ["/events", "evt"],
        ["/stock-reservations", "srv"],
        ["/stock", "stk"],
      ];
      const prefix = prefixes.find(([p]) => op.path.startsWith(p))![1];
      const res = await call(op, pathFor(op, foreign[prefix]), mine.key);
      expectDocumented(op, res);
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toContain(theirs.shopId);
    });
  }
});

describe("key lifecycle", () => {
  it("refuses a revoked key on the very next request", async () => {
    const { key, secret } = await keyFor(mine.shopId, ["catalog:read"]);
    await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`).expect(200);
    await revokeKey((await testOrm()).em.fork(), mine.shopId, key.id);
    const res = await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`);
    expect(res.status).toBe(401);
    expect(res.body.detail).toMatch(/revoked/);
  });

  it("refuses a revoked key on the next request even while requests with it are in flight", async () => {
    const { key, secret } = await keyFor(mine.shopId, ["catalog:read"]);
    const get = () =>
      request(BASE_URL)
        .get("/api/v1/shears")
        .set("Authorization", `Bearer ${secret}`)
        .then((r) => r.status);
    const during = Array.from({ length: 24 }, get); // sent before the revocation: each may pass or not
    await revokeKey((await testOrm()).em.fork(), mine.shopId, key.id);
    const after = await Promise.all(Array.from({ length: 24 }, get));
    expect(after).toEqual(Array(24).fill(401));
    expect((await Promise.all(during)).every((s) => s === 200 || s === 401)).toBe(true);
  });

  it("refuses an expired key", async () => {
    const { secret } = await keyFor(mine.shopId, ["catalog:read"], { expiresAt: new Date(Date.now() - 1000) });
    const res = await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`);
    expect(res.status).toBe(401);
    expect(res.body.detail).toMatch(/expired/);
  });

  it("refuses a made-up key and one that is not ours at all", async () => {
    for (const bad of ["swk_live_madeup", "sk_test_123", ""]) {
      const res = await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${bad}`);
      expect(res.status).toBe(401);
      expect(res.headers["content-type"]).toMatch(/application\/problem\+json/);
    }
  });

  it("records when a key was last used", async () => {
    const { key, secret } = await keyFor(mine.shopId, ["catalog:read"]);
    expect(key.lastUsedAt).toBeNull();
    await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`).expect(200);
    const em = (await testOrm()).em.fork();
    const { ApiKey } = await import("../../entities");
    const row = await em.findOneOrFail(ApiKey, { id: key.id });
    expect(row.lastUsedAt).toBeInstanceOf(Date);
  });

  it("stores no secret, only its digest and a short prefix", async () => {
    const { key, secret } = await keyFor(mine.shopId, ["catalog:read"]);
    const rows = await (await testOrm()).em.getConnection().execute("select * from api_keys where id = ?", [key.id]);
    expect(JSON.stringify(rows)).not.toContain(secret);
    expect(secret.startsWith(key.prefix)).toBe(true);
    expect(key.prefix.length).toBeLessThan(secret.length / 2);
  });
});
