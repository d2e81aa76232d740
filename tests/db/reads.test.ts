/**
 * Reads inside a transaction share its one connection: they must go one at a time. A query sent on a
 * node-postgres client while another is still running is queued by pg 8 with a deprecation warning and
 * refused by its next major version. The spy below records every query sent on a client that is busy.
 */
import pg from "pg";
import { afterAll, afterEach, beforeEach, describe, expect, it } from "vitest";
import { Grade, Shear } from "../../entities";
import { readsOf } from "../../lib/db/reads";
import { checkPrograms } from "../../lib/services/program-create";
import { closeTestOrm, createTestShop, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

type Busy = { _activeQuery: unknown; _queryQueue: unknown[] };
const original = pg.Client.prototype.query;
let overlapping = 0;

beforeEach(() => {
  overlapping = 0;
  pg.Client.prototype.query = function (this: Busy, ...args: unknown[]) {
    if (this._activeQuery || this._queryQueue.length) overlapping++;
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
});
afterEach(() => {
  pg.Client.prototype.query = original;
});

describe("reads through one entity manager", () => {
  it("the spy sees two reads sent at once on a transaction's connection", async () => {
    const shop = await createTestShop("reads-spy");
    await (await testOrm()).em.fork().transactional(async (tx) => {
      await Promise.all([tx.find(Shear, { shop: shop.shopId }), tx.find(Grade, { shop: shop.shopId })]);
    });
    expect(overlapping).toBeGreaterThan(0);
  });

  it("inside a transaction, one after another; outside, each on its own connection, at once", async () => {
    const shop = await createTestShop("reads-order");
    await (await testOrm()).em.fork().transactional(async (tx) => {
      const [shears, grades] = await readsOf(
        tx,
        () => tx.find(Shear, { shop: shop.shopId }),
        () => tx.find(Grade, { shop: shop.shopId }),
      );
      expect(shears.map((shear) => shear.id)).toEqual([shop.shearId]);
      expect(grades.length).toBeGreaterThan(3);
    });
    expect(overlapping).toBe(0);
    const em = (await testOrm()).em.fork();
    const [shears, grades] = await readsOf(
      em,
      () => em.find(Shear, { shop: shop.shopId }),
      () => em.fork().find(Grade, { shop: shop.shopId }),
    );
    expect([shears.length, grades.length > 3]).toEqual([1, true]);
    expect(overlapping).toBe(0);
  });

  it("checking programs inside a transaction (a plan's programs, an upload) sends its reads one at a time", async () => {
    const shop = await createTestShop("reads-check");
    const program = (reference: string, shear?: string) => ({
      reference,
      ...(shear ? { shear } : {}),
      grade: "A36",
      thickness: { gauge: 10 },
      units: "in" as const,
      sheet: { length: 120, width: 48, count: 1 },
      cuts: [{ backgauge: 12, count: 3 }],
    });
    await (await testOrm()).em.fork().transactional(async (tx) => {
      const checked = await checkPrograms(tx, shop.shopId, [
        program("R-1", shop.shearId),
        program("R-2", "Test shear"),
      ]);
      expect(checked.map((c) => ("shear" in c ? c.shear.id : c))).toEqual([shop.shearId, shop.shearId]);
    });
    expect(overlapping).toBe(0);
  });
});
