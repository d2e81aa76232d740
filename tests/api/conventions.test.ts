/**
 * The conventions every route shares: Idempotency-Key, rate limits, body limits and media
 * types, and generated invalid bodies that must answer 4xx problem+json and store nothing.
 */
import http from "node:http";
import fc from "fast-check";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, IdempotencyRecord, Program, RequestLog } from "../../entities";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, keyFor, testOrm, type TestShop } from "../support/fixtures";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });

beforeAll(async () => {
  shop = await createTestShop("conventions");
});
afterAll(closeTestOrm);

/** A request with any method (fetch refuses TRACE and the like). */
function raw(method: string, path: string): Promise<http.IncomingMessage> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${BASE_URL}${path}`, { method }, (res) => {
      res.resume();
      resolve(res);
    });
    req.on("error", reject);
    req.end();
  });
}

const programCount = async (shopId: string) => (await testOrm()).em.fork().count(Program, { shop: shopId });

describe("Idempotency-Key", () => {
  it("replays the stored response for the same key and body", async () => {
    const body = exampleProgram(shop.shearId);
    const first = await api().post("/api/v1/programs").set(auth()).set("Idempotency-Key", "same-1").send(body);
    const second = await api().post("/api/v1/programs").set(auth()).set("Idempotency-Key", "same-1").send(body);
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.body).toEqual(first.body);
    expect(second.headers["idempotent-replayed"]).toBe("true");
    expect(second.headers.etag).toBe(first.headers.etag);
    expect(await (await testOrm()).em.fork().count(Event, { subjectId: first.body.id })).toBe(1);
  });

  it("answers 422 when the key comes back with another body", async () => {
    await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "other-1")
      .send(exampleProgram(shop.shearId))
      .expect(201);
    const res = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "other-1")
      .send(exampleProgram(shop.shearId));
    expect(res.status).toBe(422);
    expect(res.body.type).toBe("/problems/idempotency-key-reused");
  });

  it("keeps keys per API key: another key may use the same value", async () => {
    const { secret } = await keyFor(shop.shopId, ["programs:write"]);
    const a = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "per-key")
      .send(exampleProgram(shop.shearId));
    const b = await api()
      .post("/api/v1/programs")
      .set("Authorization", `Bearer ${secret}`)
      .set("Idempotency-Key", "per-key")
      .send(exampleProgram(shop.shearId));
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).not.toBe(b.body.id);
  });

  it("keeps a record for 24 hours", async () => {
    await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "ttl-1")
      .send(exampleProgram(shop.shearId))
      .expect(201);
    const rec = await (await testOrm()).em.fork().findOneOrFail(IdempotencyRecord, { idempotencyKey: "ttl-1" });
    const hours = (rec.expiresAt.getTime() - rec.createdAt.getTime()) / 3_600_000;
    expect(hours).toBeCloseTo(24, 5);
  });

  it("replays a 4xx answer too, so a retry cannot change the outcome", async () => {
    const body = { ...exampleProgram(shop.shearId), shear: "shr_01J00000000000000000000000" };
    const first = await api().post("/api/v1/programs").set(auth()).set("Idempotency-Key", "err-1").send(body);
    const second = await api().post("/api/v1/programs").set(auth()).set("Idempotency-Key", "err-1").send(body);
    expect([first.status, second.status]).toEqual([422, 422]);
    expect(second.headers["idempotent-replayed"]).toBe("true");
  });

  it("makes 20 concurrent POSTs with one key create exactly one program", async () => {
    const own = await createTestShop("idem-race");
    const body = exampleProgram(own.shearId, "RACE-1");
    const results = await Promise.all(
      Array.from({ length: 20 }, () =>
        api()
          .post("/api/v1/programs")
          .set("Authorization", `Bearer ${own.key}`)
          .set("Idempotency-Key", "race-1")
          .send(body),
      ),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.every((s) => s === 201 || s === 409)).toBe(true);
    expect(statuses).toContain(201);
    const created = new Set(results.filter((r) => r.status === 201).map((r) => r.body.id));
    expect(created.size).toBe(1);
    expect(await programCount(own.shopId)).toBe(1);
  });

  it("refuses a malformed key", async () => {
    const res = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Idempotency-Key", "x".repeat(300))
      .send(exampleProgram(shop.shearId));
    expect(res.status).toBe(400);
    expect(res.body.type).toBe("/problems/bad-idempotency-key");
  });
});

describe("rate limits", () => {
  it("announces the budget and answers 429 with Retry-After when it is spent", async () => {
    const { secret } = await keyFor(shop.shopId, ["catalog:read"], { rateLimitPerMin: 3 });
    const get = () => api().get("/api/v1/gauges?family=awg").set("Authorization", `Bearer ${secret}`);
    const first = await get();
    expect(first.headers["ratelimit-policy"]).toBe('"per-key";q=3;w=60');
    expect(first.headers.ratelimit).toMatch(/^"per-key";r=2;t=\d+$/);
    await get();
    await get();
    const limited = await get();
    expect(limited.status).toBe(429);
    expect(Number(limited.headers["retry-after"])).toBeGreaterThan(0);
    expect(limited.headers.ratelimit).toMatch(/^"per-key";r=0;/);
    expect(limited.headers["content-type"]).toMatch(/problem\+json/);
  });
});

describe("bodies", () => {
  it("refuses a body over the size limit with 413", async () => {
    const huge = { ...exampleProgram(shop.shearId), title: "x".repeat(1_100_000) };
    const res = await api().post("/api/v1/programs").set(auth()).send(huge);
    expect(res.status).toBe(413);
  });

  it("refuses a body that is not JSON with 415, and broken JSON with 400", async () => {
    const form = await api().post("/api/v1/programs").set(auth()).set("Content-Type", "text/plain").send("reference=1");
    expect(form.status).toBe(415);
    const broken = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Content-Type", "application/json")
      .send('{"reference":');
    expect(broken.status).toBe(400);
    expect(broken.body.detail).toMatch(/not valid JSON/);
  });

  it("answers generated invalid programs with 4xx problem+json, never 5xx, and stores nothing", async () => {
    const own = await createTestShop("fuzz");
    const valid = exampleProgram(own.shearId);
    // Break a valid program in one or more places: wrong types, out-of-range numbers, unknown fields, missing fields.
    const junk = fc.oneof(
      fc.string(),
      fc.integer(),
      fc.double(),
      fc.boolean(),
      fc.constant(null),
      fc.array(fc.integer(), { maxLength: 3 }),
      fc.object({ maxDepth: 1 }),
    );
    const field = fc.constantFrom(
      "reference",
      "shear",
      "grade",
      "thickness",
      "units",
      "sheet",
      "cuts",
      "setup",
      "priority",
      "dueAt",
      "metadata",
      "title",
    );
    const breakage = fc.oneof(
      fc.record({ kind: fc.constant("set" as const), field, value: junk }),
      fc.record({
        kind: fc.constant("drop" as const),
        field: fc.constantFrom("reference", "shear", "grade", "thickness", "units", "sheet", "cuts"),
      }),
      fc.record({
        kind: fc.constant("extra" as const),
        field: fc.string({ minLength: 1, maxLength: 8 }).filter((k) => !(k in valid)),
        value: junk,
      }),
      fc.record({
        kind: fc.constant("cut" as const),
        field: fc.constantFrom("backgauge", "count", "length", "turn"),
        value: fc.oneof(junk, fc.constantFrom(-1, 0, 1e9, Number.NaN)),
      }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(breakage, { minLength: 1, maxLength: 3 }), async (changes) => {
        const body: Record<string, unknown> = structuredClone(valid);
        for (const c of changes) {
          if (c.kind === "set") body[c.field] = c.value;
          else if (c.kind === "drop") delete body[c.field];
          else if (c.kind === "extra") body[c.field] = c.value;
          else (body.cuts as Record<string, unknown>[])[0] = { ...valid.cuts[0], [c.field]: c.value };
        }
        const res = await api()
          .post("/api/v1/programs")
          .set("Authorization", `Bearer ${own.key}`)
          .set("Content-Type", "application/json")
          .send(JSON.stringify(body));
        if (res.status === 201) {
          // some breakages keep the program valid (e.g. a new title); then it is stored as usual
          await (await testOrm()).em.fork().nativeDelete(Program, { id: res.body.id });
          return;
        }
        expect(res.status).toBeGreaterThanOrEqual(400);
        expect(res.status).toBeLessThan(500);
        expect(res.headers["content-type"]).toMatch(/application\/problem\+json/);
        expect(res.body).toMatchObject({
          type: expect.any(String),
          title: expect.any(String),
          status: res.status,
          detail: expect.any(String),
        });
      }),
      { numRuns: 60, seed: 20261201 },
    );
    expect(await programCount(own.shopId)).toBe(0);
  });
});

describe("what callers choose cannot break the request or the log", () => {
  it("answers a path of 300+ characters without a 500, with or without an Idempotency-Key, and logs the other requests of the same batch", async () => {
    const other = await createTestShop("log-neighbour");
    const longId = `prg_${"A".repeat(400)}`;
    const [plain, keyed, neighbour] = await Promise.all([
      api().get(`/api/v1/programs/${longId}`).set(auth()),
      api().post(`/api/v1/programs/${longId}/cancel`).set(auth()).set("Idempotency-Key", "long-path-1").send({}),
      api().get("/api/v1/shears").set("Authorization", `Bearer ${other.key}`),
    ]);
    expect(plain.status).toBeLessThan(500);
    expect(keyed.status).toBeLessThan(500);
    expect(neighbour.status).toBe(200);
    // The rows are written in one batch within a second; the other shop's row is among them.
    const em = (await testOrm()).em.fork();
    const ids = [plain.headers["x-request-id"], keyed.headers["x-request-id"], neighbour.headers["x-request-id"]];
    let found = 0;
    for (let i = 0; i < 40 && found < 3; i++) {
      await new Promise((r) => setTimeout(r, 100));
      found = await em.count(RequestLog, { id: { $in: ids } });
    }
    expect(found).toBe(3);
    const long = await em.findOneOrFail(RequestLog, { id: plain.headers["x-request-id"] });
    expect(long.path.length).toBeGreaterThan(255);
  });

  it("answers TRACE and other methods nothing serves with 405 problem+json and Allow", async () => {
    for (const [method, path] of [
      ["TRACE", "/api/v1/programs"],
      ["PROPFIND", "/api/v1/programs"],
      ["MKCOL", "/console"],
    ]) {
      const res = await raw(method, path);
      expect(res.statusCode, method).toBe(405);
      expect(res.headers.allow).toMatch(/GET/);
      expect(res.headers["content-type"]).toMatch(/problem\+json/);
      expect(res.headers["x-content-type-options"]).toBe("nosniff");
    }
  });

  it("answers a method a path does not take with 405 problem+json naming the methods it does", async () => {
    for (const [method, path, allow] of [
      ["DELETE", "/api/v1/health", "GET, HEAD, OPTIONS"],
      ["GET", "/api/v1/programs/batch", "OPTIONS, POST"],
      ["PUT", `/api/v1/programs/prg_${"x".repeat(26)}`, "GET, HEAD, OPTIONS, PATCH"],
    ]) {
      const res = await api()[method.toLowerCase() as "get" | "delete" | "put"](path).set(auth());
      expect(res.status, `${method} ${path}`).toBe(405);
      expect(res.headers.allow).toBe(allow);
      expect(res.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({ type: "/problems/method-not-allowed", status: 405, instance: path });
    }
    // and the framework's own answer to OPTIONS agrees
    const options = await api().options("/api/v1/programs/batch");
    expect(options.status).toBe(204);
    expect(options.headers.allow).toBe("OPTIONS, POST");
  });

  it("answers a path the API does not have with 404 problem+json, hostile paths included", async () => {
    for (const path of [
      "/api/v1/webhooks",
      "/api/v1/programs/prg_1/nothing",
      "/api/v1/Programs",
      "/api/v1/%00%01",
      `/api/v1/${"deep/".repeat(1500)}end`,
    ]) {
      const res = await api().post(path).set(auth()).send({ a: 1 });
      expect(res.status, path.slice(0, 60)).toBe(404);
      expect(res.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(res.headers["x-content-type-options"]).toBe("nosniff");
      expect(res.body).toMatchObject({ type: "/problems/unknown-path", status: 404 });
      expect(res.body.instance.length).toBeLessThanOrEqual(2000);
    }
    // the page the problem type points at exists
    const page = await api().get("/problems/unknown-path");
    expect(page.status).toBe(200);
    expect(page.text).toContain("No such path in the API");
  });

  it("stops reading a chunked body at the limit: the 413 comes while the client is still sending", async () => {
    const total = 64 * 1024 * 1024;
    const { status, sentBeforeAnswer } = await new Promise<{ status: number; sentBeforeAnswer: number }>(
      (resolve, reject) => {
        let sent = 0;
        let answered = false;
        const req = http.request(
          `${BASE_URL}/api/v1/programs`,
          { method: "POST", headers: { ...auth(), "Content-Type": "application/json" } },
          (res) => {
            answered = true;
            res.resume();
            resolve({ status: res.statusCode ?? 0, sentBeforeAnswer: sent });
            req.destroy();
          },
        );
        req.on("error", (err) => {
          if (!answered) reject(err);
        });
        const chunk = Buffer.alloc(64 * 1024, "x");
        const write = () => {
          while (!answered && sent < total) {
            sent += chunk.length;
            if (!req.write(chunk)) return void req.once("drain", write);
          }
          if (!answered) req.end();
        };
        req.write('{"reference":"R","title":"');
        write();
      },
    );
    expect(status).toBe(413);
    expect(sentBeforeAnswer).toBeLessThan(total);
  });

  it("refuses NUL and broken Unicode where they arrive, naming the place", async () => {
    const body = { ...exampleProgram(shop.shearId), metadata: { line: "a\ud800b" } };
    const res = await api()
      .post("/api/v1/programs")
      .set(auth())
      .set("Content-Type", "application/json")
      .send(JSON.stringify(body));
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      { location: "body", pointer: "/metadata/line", message: expect.stringMatching(/unpaired UTF-16 surrogate/) },
    ]);
    const query = await api().get("/api/v1/programs?reference=a%00b").set(auth());
    expect(query.status).toBe(422);
    expect(query.body.errors[0]).toMatchObject({ location: "query", pointer: "/reference" });
    const path = await api().get("/api/v1/programs/prg_%00").set(auth());
    expect(path.status).toBe(422);
    expect(path.body.errors[0]).toMatchObject({ location: "path", pointer: "/id" });
    const cursor = Buffer.from(JSON.stringify({ after: "prg_\u0000" })).toString("base64url");
    expect((await api().get(`/api/v1/programs?cursor=${cursor}`).set(auth())).status).toBe(400);
  });
});
