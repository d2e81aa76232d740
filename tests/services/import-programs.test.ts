/**
 * The console's upload goes through the batch create path: all of a file's programs or none,
 * a refusal named by its row (the program's first line in the file).
 */
import { afterAll, describe, expect, it } from "vitest";
import { Event, Program } from "../../entities";
import { importPrograms, parseCsv, validate } from "../../lib/services/import";
import { closeTestOrm, createTestShop, exampleProgram, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

const header =
  "reference,title,shear,grade,thickness,gauge,units,sheet_length,sheet_width,sheet_count,backgauge,count,length,turn,scrap,note,priority,due_at";
const rows = (ref: string, shear: string) => [
  `${ref},Brackets,${shear},A36,,10,in,120,48,1,12,3,,,,rips,5,`,
  `${ref},,,,,,,,,,16,7,12,yes,,,,`,
];

describe("importing a cut list", () => {
  it("creates every program with its event, or names the row of each refusal and creates none", async () => {
    const shop = await createTestShop("import");
    const em = (await testOrm()).em.fork();
    const { createProgram } = await import("../../lib/services/programs");
    await createProgram(em, shop.shopId, exampleProgram(shop.shearId, "IM-taken"));

    const parsed = parseCsv(
      [
        header,
        ...rows("IM-1", shop.shearId),
        ...rows("IM-taken", shop.shearId),
        ...rows("IM-3", "shr_01J00000000000000000000000"),
      ].join("\n"),
    );
    const { inputs, errors } = validate(parsed);
    expect(errors).toEqual([]);
    const refused = await importPrograms(em, shop.shopId, inputs, (i) => parsed.programs[i].rows[0]);
    expect(refused.created).toEqual([]);
    expect(refused.errors.map((e) => [e.row, e.field])).toEqual([
      [4, "program"],
      [6, "shear"],
    ]);
    expect(refused.errors[0].message).toMatch(/IM-taken.*already exists/);
    const count = () => em.fork().count(Program, { shop: shop.shopId, reference: { $in: ["IM-1", "IM-3"] } });
    expect(await count()).toBe(0);

    const fixed = parseCsv([header, ...rows("IM-1", shop.shearId), ...rows("IM-3", shop.shearId)].join("\n"));
    const done = await importPrograms(em, shop.shopId, validate(fixed).inputs, (i) => fixed.programs[i].rows[0]);
    expect(done.errors).toEqual([]);
    expect(done.created.map((c) => c.reference)).toEqual(["IM-1", "IM-3"]);
    expect(await count()).toBe(2);
    const events = await em.fork().count(Event, { subjectId: { $in: done.created.map((c) => c.id) } });
    expect(events).toBe(2);
  });
});
