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
import { DISPATCH_BATCH, dispatchAll } from "../../lib/worker/dispatch";
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
});
