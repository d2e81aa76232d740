/**
 * The long-poll claim as a service: a waiting gateway is woken by the release itself
 * (PostgreSQL NOTIFY on commit) instead of asking the database over and over.
 */
import { EntityManager } from "@mikro-orm/postgresql";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { claimNext } from "../../lib/services/gateway";
import { authenticate } from "../../lib/services/keys";
import { createProgram, releaseProgram } from "../../lib/services/programs";
import { DATABASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, keyFor, testOrm } from "../support/fixtures";

beforeAll(() => {
  process.env.DATABASE_URL = DATABASE_URL; // the notification listener connects where the test database is
});
afterAll(closeTestOrm);

describe("a waiting gateway", () => {
  it("is woken by the release, with a handful of transactions where polling four times a second would need dozens", async () => {
    const shop = await createTestShop("quiet-wait");
    const em = (await testOrm()).em.fork();
    const principal = await authenticate(em, `Bearer ${(await keyFor(shop.shopId, ["gateway"])).secret}`);
    const transactions = vi.spyOn(EntityManager.prototype, "transactional");
    try {
      const waiting = claimNext(em.fork(), principal, shop.shearId, { waitSeconds: 4 });
      await new Promise((r) => setTimeout(r, 1_500));
      const before = transactions.mock.calls.length;
      const { id } = await createProgram(em.fork(), shop.shopId, exampleProgram(shop.shearId));
      await releaseProgram(em.fork(), shop.shopId, id);
      const madeByRelease = transactions.mock.calls.length - before;
      const claim = await waiting;
      expect(claim?.program.id).toBe(id);
      const byWaiter = transactions.mock.calls.length - madeByRelease;
      // Looking once on arrival and once on being woken is 2 × (lease sweep + claim) = 4; a 250 ms poll would be ≥ 12.
      expect(byWaiter).toBeLessThanOrEqual(6);
    } finally {
      transactions.mockRestore();
    }
  });

  it("ends an empty wait on time, looking only a few times (a slow safety poll)", async () => {
    const shop = await createTestShop("empty-wait");
    const em = (await testOrm()).em.fork();
    const principal = await authenticate(em, `Bearer ${(await keyFor(shop.shopId, ["gateway"])).secret}`);
    const transactions = vi.spyOn(EntityManager.prototype, "transactional");
    try {
      expect(await claimNext(em.fork(), principal, shop.shearId, { waitSeconds: 2 })).toBeNull();
      expect(transactions.mock.calls.length).toBeLessThanOrEqual(6);
    } finally {
      transactions.mockRestore();
    }
  });
});
