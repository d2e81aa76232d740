/**
 * The shared lookups read shears and grades as plain records, not entities: every field the
 * catalog's views and the shear core's profiles read must come out as the entity has it.
 */
import { afterAll, describe, expect, it } from "vitest";
import { Grade, Shear } from "../../entities";
import { gradeProfile, shearProfile, viewGrade, viewShear } from "../../lib/services/catalog";
import { gradesByCode, shearsNamed } from "../../lib/services/lookups";
import { closeTestOrm, createTestShop, testOrm } from "../support/fixtures";

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
});
