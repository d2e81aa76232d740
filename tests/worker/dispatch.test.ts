/**
 * The worker's fan-out drains a burst in one wake-up: rounds go on while a round takes a full
 * batch of events, however few deliveries they make. On a database of its own, so no running
 * worker takes the events first.
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event, Shop, WebhookEndpoint } from "../../entities";
import { ormConfig } from "../../lib/db/config";
import { migrateUp } from "../../lib/db/migrate";
import { DISPATCH_BATCH, TAKE, dispatchAll } from "../../lib/worker/dispatch";
import { recreateDatabase } from "../support/db";

let orm: MikroORM;

beforeAll(async () => {
  orm = await MikroORM.init(ormConfig(await recreateDatabase("shearwire_dispatch")));
  await migrateUp(orm);
});
afterAll(async () => orm?.close(true));

async function burst(slug: string, events: number) {
  const em = orm.em.fork();
  const shop = em.create(Shop, { name: slug, slug });
  for (let index = 0; index < events; index++)
    em.create(Event, { shop, type: "program.created", subjectId: `prg_${slug}_${index}`, data: {} });
  await em.flush();
  return shop;
}

const waiting = async () =>
  (
    await orm.em
      .fork()
      .getConnection()
      .execute<{ n: string }[]>(`select count(*) as n from events where dispatched_at is null`)
  )[0].n;

describe("fanning out events", () => {
  it("takes every event of a burst in one call, even when they make no deliveries (a shop without endpoints)", async () => {
    const events = 2 * DISPATCH_BATCH + 50;
    await burst("quiet", events);
    const written: string[] = [];
    expect(
      await dispatchAll(
        () => orm.em.fork(),
        (ids) => written.push(...ids),
      ),
    ).toBe(events);
    expect(Number(await waiting())).toBe(0);
    expect(written).toEqual([]);
  });

  it("hands over each round's deliveries as they are written, one per event and matching endpoint", async () => {
    const shop = await burst("busy", DISPATCH_BATCH + 10);
    const em = orm.em.fork();
    em.create(WebhookEndpoint, {
      shop: em.getReference(Shop, shop.id),
      url: "https://erp.example/hooks",
      secret: "whsec_dGVzdA==",
    });
    em.create(WebhookEndpoint, {
      shop: em.getReference(Shop, shop.id),
      url: "https://erp.example/released",
      secret: "whsec_dGVzdA==",
      eventTypes: ["program.released"],
    });
    await em.flush();
    const rounds: number[] = [];
    expect(
      await dispatchAll(
        () => orm.em.fork(),
        (ids) => rounds.push(ids.length),
      ),
    ).toBe(DISPATCH_BATCH + 10);
    expect(rounds).toEqual([DISPATCH_BATCH, 10]); // the second endpoint takes only released programs
    expect(Number(await waiting())).toBe(0);
  });

  it("makes one pending delivery with a valid id per event and endpoint; test events make none", async () => {
    const shop = await burst("ids", 3);
    const em = orm.em.fork();
    for (const url of ["https://erp.example/a", "https://erp.example/b"])
      em.create(WebhookEndpoint, { shop: em.getReference(Shop, shop.id), url, secret: "whsec_dGVzdA==" });
    em.create(Event, { shop, type: "endpoint.test", subjectId: "whe_test", data: {} });
    await em.flush();
    const written: string[] = [];
    await dispatchAll(
      () => orm.em.fork(),
      (ids) => written.push(...ids),
    );
    expect(written).toHaveLength(6); // three events × two endpoints; the test event goes to no one here
    expect(new Set(written).size).toBe(6);
    for (const id of written) expect(id).toMatch(/^dlv_[0-9A-Z]{26}$/);
    const rows = await orm.em
      .fork()
      .getConnection()
      .execute<{ id: string; event_id: string; status: string; attempts: number; next_attempt_at: unknown }[]>(
        `select id, event_id, status, attempts, next_attempt_at from deliveries where shop_id = ?`,
        [shop.id],
      );
    expect(rows.map((r) => r.id).sort()).toEqual([...written].sort());
    for (const row of rows) {
      expect(row).toMatchObject({ status: "pending", attempts: 0 });
      expect(row.next_attempt_at).not.toBeNull();
    }
  });

  it("fans each event out exactly once when two workers dispatch the same burst at once", async () => {
    const shop = await burst("twice", DISPATCH_BATCH * 2 + 30);
    const em = orm.em.fork();
    em.create(WebhookEndpoint, {
      shop: em.getReference(Shop, shop.id),
      url: "https://erp.example/hooks",
      secret: "whsec_dGVzdA==",
    });
    await em.flush();
    const written: string[] = [];
    const [first, second] = await Promise.all(
      [0, 1].map(() =>
        dispatchAll(
          () => orm.em.fork(),
          (ids) => written.push(...ids),
        ),
      ),
    );
    expect(first + second).toBe(DISPATCH_BATCH * 2 + 30);
    expect(written).toHaveLength(DISPATCH_BATCH * 2 + 30);
    const [{ events }] = await orm.em
      .fork()
      .getConnection()
      .execute<{ events: string }[]>(`select count(distinct event_id) as events from deliveries where shop_id = ?`, [
        shop.id,
      ]);
    expect(Number(events)).toBe(DISPATCH_BATCH * 2 + 30);
  });

  it("reads only the waiting events, not those already fanned out, even with statistics taken while most waited", async () => {
    // statistics taken during a burst (nearly every event waiting), then the burst fanned out: the
    // statistics now say most events wait, and only a few do
    await burst("history", 3000);
    const connection = orm.em.fork().getConnection();
    await connection.execute("analyze events");
    await dispatchAll(
      () => orm.em.fork(),
      () => undefined,
    );
    await burst("fresh", 5);
    type PlanNode = {
      "Node Type": string;
      "Relation Name"?: string;
      "Index Name"?: string;
      "Rows Removed by Filter"?: number;
      Plans?: PlanNode[];
    };
    // EXPLAIN ANALYZE runs the statement: in a transaction rolled back, so the events still wait afterwards
    const transaction = await orm.em.getConnection().getKnex().transaction();
    const explained = await transaction.raw(`explain (analyze, format json) ${TAKE.replace("$1", "now()")}`);
    await transaction.rollback();
    const plan = (explained as { rows: { "QUERY PLAN": [{ Plan: PlanNode }] }[] }).rows[0]["QUERY PLAN"];
    const nodes: PlanNode[] = [];
    const collect = (node: PlanNode) => {
      nodes.push(node);
      node.Plans?.forEach(collect);
    };
    collect(plan[0].Plan);
    // the waiting events come from the partial index, and no row is read only to be filtered out
    expect(nodes.some((node) => node["Index Name"] === "events_pending_index")).toBe(true);
    const onEvents = nodes.filter((node) => node["Relation Name"] === "events");
    expect(onEvents.reduce((sum, node) => sum + (node["Rows Removed by Filter"] ?? 0), 0)).toBe(0);
    expect(Number(await waiting())).toBe(5);
  });
});
