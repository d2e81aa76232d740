import { afterAll, describe, expect, it } from "vitest";
import { Event, Program } from "../../entities";
import { createProgram } from "../../lib/services/programs";
import { viewProgram } from "../../lib/services/program-view";
import { recordEvent } from "../../lib/services/events";
import { closeTestOrm, createTestShop, exampleProgram, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

describe("the outbox", () => {
  it("writes the event in the same transaction as the change: a rolled-back change leaves no event", async () => {
    const shop = await createTestShop("outbox");
    const em = (await testOrm()).em.fork();
    const { id } = await createProgram(em, shop.shopId, exampleProgram(shop.shearId));
    await expect(
      em.fork().transactional(async (tx) => {
        const p = await tx.findOneOrFail(Program, { id });
        p.title = "changed, then rolled back";
        await tx.flush();
        await recordEvent(tx, shop.shopId, "program.updated", id, { program: viewProgram(p), changed: ["title"] });
        throw new Error("something failed after the change");
      }),
    ).rejects.toThrow("something failed");
    const fresh = (await testOrm()).em.fork();
    expect((await fresh.findOneOrFail(Program, { id })).title).toBe("Side panels, lot 4");
    expect((await fresh.find(Event, { subjectId: id })).map((e) => e.type)).toEqual(["program.created"]);
  });
});
