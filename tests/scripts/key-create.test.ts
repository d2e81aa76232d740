import { spawnSync } from "node:child_process";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BASE_URL, DATABASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, type TestShop } from "../support/fixtures";

let shop: TestShop;
beforeAll(async () => {
  shop = await createTestShop("keycli");
});
afterAll(closeTestOrm);

const cli = (...args: string[]) =>
  spawnSync("node_modules/.bin/tsx", ["scripts/key-create.ts", ...args], {
    encoding: "utf8",
    env: { ...process.env, DATABASE_URL },
  });

describe("npm run key:create", () => {
  it("creates a scoped key whose secret is printed once and works against the API", () => {
    const res = cli("--shop", shop.shopId, "--scopes", "catalog:read", "--name", "ERP import");
    expect(res.status, res.stderr).toBe(0);
    const secret = res.stdout.match(/secret \(shown once\): (swk_\S+)/)?.[1];
    expect(secret).toBeDefined();
    return Promise.all([
      request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`).expect(200),
      request(BASE_URL).get("/api/v1/programs").set("Authorization", `Bearer ${secret}`).expect(403),
    ]);
  });

  it("refuses unknown scopes and shops with a clear message", () => {
    const badScope = cli("--shop", shop.shopId, "--scopes", "programs:everything");
    expect(badScope.status).toBe(2);
    expect(badScope.stderr).toMatch(/unknown scope\(s\) programs:everything/);
    const badShop = cli("--shop", "no-such-shop", "--scopes", "all");
    expect(badShop.status).toBe(2);
    expect(badShop.stderr).toMatch(/no shop with id or slug "no-such-shop"/);
  });
});
