/**
 * The shared lookups read shears and grades as plain records, not entities: every field the
 * catalog's views and the shear core's profiles read must come out as the entity has it. They
 * are prepared statements kept per connection, so they must survive a column added meanwhile.
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { afterAll, describe, expect, it } from "vitest";
import { Grade, Shear } from "../../entities";
import { gradeProfile, shearProfile, viewGrade, viewShear } from "../../lib/services/catalog";
import { gradesByCode, shearsNamed } from "../../lib/services/lookups";
import { ormConfig } from "../../lib/db/config";
import { closeTestOrm, createTestShop, testOrm } from "../support/fixtures";
import { DATABASE_URL } from "../support/env";

afterAll(closeTestOrm);

describe("the shared lookups", () => {
  it("read a shear and its grades with every field the views and profiles use, as the entities have them", async () => {
    const shop = await createTestShop("lookups");
    const em = (await testOrm()).em.fork();
    const shear = await em.findOneOrFail(Shear, { id: shop.shearId });
    // fields that are often left empty, filled here so the comparison covers them
    shear.crownAtRatedMm = 0.21;
    shear.backgaugeRepeatabilityMm = 0.05;
    shear.gradeThicknessLimitsMm = { A36: 6 };
    shear.archivedAt = new Date("2026-11-30T08:00:00Z");
    await em.flush();
    const grades = await em.find(Grade, { shop: shop.shopId, archivedAt: null });
    expect(grades.length).toBeGreaterThan(3);

    const fresh = (await testOrm()).em.fork();
    const [shearOf, gradeOf] = await Promise.all([
      shearsNamed(fresh, shop.shopId, [shop.shearId]),
      gradesByCode(
        fresh,
        shop.shopId,
        grades.map((grade) => grade.code),
      ),
    ]);
    const record = shearOf(shop.shearId)!;
    expect(viewShear(record)).toEqual(viewShear(shear));
    expect(shearProfile(record)).toEqual(shearProfile(shear));
    for (const grade of grades) {
      expect(viewGrade(gradeOf.get(grade.code)!)).toEqual(viewGrade(grade));
      expect(gradeProfile(gradeOf.get(grade.code)!)).toEqual(gradeProfile(grade));
    }
  });

  it("keep answering on the same connection after a column is added to the tables they read", async () => {
    const shop = await createTestShop("lookups-shape");
    // one connection, so the second lookup meets the statements the first one prepared
    const orm = await MikroORM.init({ ...ormConfig(DATABASE_URL), pool: { min: 1, max: 1 } });
    const admin = (await testOrm()).em.fork().getConnection();
    try {
      const before = await shearsNamed(orm.em.fork(), shop.shopId, [shop.shearId]);
      expect((await gradesByCode(orm.em.fork(), shop.shopId, ["A36"])).get("A36")?.code).toBe("A36");
      await admin.execute("alter table shears add column lookup_probe int");
      await admin.execute("alter table grades add column lookup_probe int");
      const after = await shearsNamed(orm.em.fork(), shop.shopId, [shop.shearId]);
      expect(after(shop.shearId)).toEqual(before(shop.shearId));
      expect((await gradesByCode(orm.em.fork(), shop.shopId, ["A36"])).get("A36")?.code).toBe("A36");
    } finally {
      await admin.execute("alter table shears drop column if exists lookup_probe");
      await admin.execute("alter table grades drop column if exists lookup_probe");
      await orm.close(true);
    }
  });
});
