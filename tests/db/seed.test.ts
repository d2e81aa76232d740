import { MikroORM } from "@mikro-orm/postgresql";
import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  ApiKey,
  Event,
  Grade,
  Membership,
  Plan,
  Program,
  Shear,
  StockItem,
  StockReservation,
  User,
} from "../../entities";
import { ormConfig } from "../../lib/db/config";
import { migrateUp } from "../../lib/db/migrate";
import { isId } from "../../lib/ids";
import { EXAMPLE_PLAN, PlanInputSchema } from "../../lib/schemas/plan";
import { EXAMPLE_PROGRAM, ProgramInputSchema } from "../../lib/schemas/program";
import { createPlan } from "../../lib/services/plans";
import { validateProgram } from "../../lib/services/programs";
import { DEMO_PASSWORD, seedDemo } from "../../scripts/lib/seed";
import { recreateDatabase } from "../support/db";

let orm: MikroORM;

beforeAll(async () => {
  orm = await MikroORM.init(ormConfig(await recreateDatabase("shearwire_seed")));
  await migrateUp(orm);
});
afterAll(async () => orm?.close(true));

describe("demo seed", () => {
  it("creates the demo shop with two shears of different capacity, the grade library and an owner", async () => {
    const demo = await seedDemo(orm.em.fork());
    expect(isId("shop", demo.shop.id)).toBe(true);
    expect(demo.shears).toHaveLength(2);
    for (const s of demo.shears) expect(isId("shear", s.id)).toBe(true);

    const em = orm.em.fork();
    const shears = await em.find(Shear, {}, { orderBy: { ratedThicknessMm: "asc" } });
    expect(shears[0].ratedThicknessMm).toBeLessThan(shears[1].ratedThicknessMm);
    expect(await em.count(Grade, { shop: demo.shop.id })).toBe(demo.grades);
    expect(demo.grades).toBeGreaterThanOrEqual(8);

    const owner = await em.findOneOrFail(User, { email: demo.owner.email });
    expect(await bcrypt.compare(DEMO_PASSWORD, owner.passwordHash!)).toBe(true);
    const membership = await em.findOneOrFail(Membership, { user: owner, shop: demo.shop.id });
    expect(membership.role).toBe("owner");
  });

  it("plans the demo order on the first shear: everything placed, within the sheets on hand", async () => {
    const demo = await seedDemo(orm.em.fork());
    const plan = await orm.em.fork().findOneOrFail(Plan, { id: demo.plan.id });
    expect(plan.status).toBe("complete");
    const result = plan.result as {
      coverage: string;
      findings: unknown[];
      stock: { count: number | null; used: number }[];
      summary: { short: number };
    };
    expect(result.coverage).toBe("complete");
    expect(result.summary.short).toBe(0);
    for (const s of result.stock) if (s.count !== null) expect(s.used).toBeLessThanOrEqual(s.count);
  });

  it("runs the reference's examples as written: the program and the plan name the demo shop's first shear", async () => {
    const demo = await seedDemo(orm.em.fork());
    const check = await validateProgram(orm.em.fork(), demo.shop.id, ProgramInputSchema.parse(EXAMPLE_PROGRAM));
    expect(check.validation).not.toBe("fail");
    expect(check.yield?.total).toMatchObject({ blanks: 56, strokes: 62 }); // the worked example the quickstart describes
    const em = orm.em.fork();
    const plan = await createPlan(em, demo.shop.id, PlanInputSchema.parse(EXAMPLE_PLAN), { queue: false });
    expect(plan.shear).toBe(demo.shears.find((s) => s.name === "Bay 1 sheet shear")!.id);
    await em.nativeDelete(Plan, { id: plan.id });
  });

  it("sets the demo plan's programs going: one run to the end by its shear's gateway, one released, the rest drafts", async () => {
    const demo = await seedDemo(orm.em.fork());
    const em = orm.em.fork();
    const programs = await em.find(Program, { shop: demo.shop.id }, { orderBy: { reference: "asc" } });
    const plan = await em.findOneOrFail(Plan, { id: demo.plan.id });
    expect(programs.map((p) => p.id).sort()).toEqual((plan.programs ?? []).map((p) => p.id).sort());
    const byStatus = (status: string) => programs.filter((p) => p.status === status);
    expect(byStatus("completed")).toHaveLength(1);
    expect(byStatus("released")).toHaveLength(programs.length > 1 ? 1 : 0);
    expect(byStatus("draft")).toHaveLength(Math.max(0, programs.length - 2));
    const [done] = byStatus("completed");
    // The report books every blank the program's own check counts, on the sheets it names.
    expect(done.outcome).toMatchObject({
      result: "completed",
      goodPieces: done.check!.yield!.total.blanks,
      sheetsUsed: (done.input as { sheet: { count: number } }).sheet.count,
    });
    const gateway = await em.findOneOrFail(ApiKey, { id: done.claimedBy! });
    expect(gateway.scopes).toEqual(["gateway"]);
    expect(gateway.shearIds).toEqual([done.shear.id]);
    const events = await em.find(Event, { subjectId: done.id }, { orderBy: { id: "asc" } });
    expect(events.map((e) => e.type)).toEqual([
      "program.created",
      "program.released",
      "program.claimed",
      "program.started",
      "program.completed",
    ]);
  });

  it("puts sheets on the racks and plans the demo order from them: the run books its sheets, the released one holds its own", async () => {
    const demo = await seedDemo(orm.em.fork());
    const em = orm.em.fork();
    const items = await em.find(StockItem, { shop: demo.shop.id }, { orderBy: { id: "asc" } });
    expect(items.length).toBeGreaterThanOrEqual(3);
    expect(items.some((item) => item.kind === "remnant")).toBe(true);
    const plan = await em.findOneOrFail(Plan, { id: demo.plan.id });
    const drawn = (plan.result as { stock: { item?: string | null; used: number }[] }).stock;
    expect(drawn.length).toBeGreaterThan(0);
    for (const row of drawn) expect(items.map((item) => item.id)).toContain(row.item);
    const programs = await em.find(Program, { shop: demo.shop.id });
    const reservations = await em.find(StockReservation, { shop: demo.shop.id });
    const [done] = programs.filter((program) => program.status === "completed");
    const [waiting] = programs.filter((program) => program.status === "released");
    // the run's sheets were booked out of stock; the released program's are still held for it
    const sheetsOf = (program: typeof done, status: string) =>
      reservations
        .filter((r) => r.program === program.id && r.status === status)
        .reduce((sum, r) => sum + r.quantity, 0);
    expect(sheetsOf(done, "consumed")).toBe((done.input as { sheet: { count: number } }).sheet.count);
    if (waiting) expect(sheetsOf(waiting, "open")).toBe((waiting.input as { sheet: { count: number } }).sheet.count);
    const onHand = items.reduce((sum, item) => sum + item.quantity, 0);
    expect(onHand).toBe(12 + 4 + 1 + 6 + 8 - sheetsOf(done, "consumed"));
  });

  it("is idempotent", async () => {
    const first = await seedDemo(orm.em.fork());
    const second = await seedDemo(orm.em.fork());
    expect(second).toEqual(first);
    expect(await orm.em.fork().count(Shear)).toBe(2);
    expect(await orm.em.fork().count(Plan)).toBe(1);
    expect(await orm.em.fork().count(ApiKey)).toBe(1); // the demo gateway's, once
  });
});
