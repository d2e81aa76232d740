import { afterAll, describe, expect, it } from "vitest";
import { Membership, User } from "../../entities";
import { changeRole, invite, removeMember } from "../../lib/services/team";
import { closeTestOrm, createTestShop, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

describe("the team", () => {
  it("keeps at least one owner: the last one can be neither demoted nor removed", async () => {
    const shop = await createTestShop("team");
    const em = (await testOrm()).em.fork();
    const owner = await em.findOneOrFail(Membership, { shop: shop.shopId, role: "owner" });
    await expect(changeRole(em, shop.shopId, owner.id, "admin")).rejects.toThrow(/at least one owner/);
    await expect(removeMember(em, shop.shopId, owner.id)).rejects.toThrow(/last owner/);
    const admin = await em.findOneOrFail(Membership, { shop: shop.shopId, role: "admin" });
    await changeRole(em, shop.shopId, admin.id, "owner");
    await removeMember(em, shop.shopId, owner.id); // now there is another owner
    expect(await em.count(Membership, { shop: shop.shopId, role: "owner" })).toBe(1);
  });

  it("refuses to invite someone already in the shop", async () => {
    const shop = await createTestShop("team-dup");
    const em = (await testOrm()).em.fork();
    const someone = await em.findOneOrFail(User, { email: shop.viewer });
    await expect(invite(em, shop.shopId, { userId: someone.id, name: "x" }, shop.viewer, "admin")).rejects.toThrow(
      /already in this shop/,
    );
  });
});
