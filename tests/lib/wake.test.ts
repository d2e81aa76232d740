/**
 * Wake-ups after commit: one per moment for the calls of that moment, at most one per interval
 * under a stream of calls, and at once after a quiet spell. The connection here records the
 * statements it is asked to run (the wake-ups reaching a real listener are covered by the
 * webhook tests, which wait for deliveries woken this way).
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { describe, expect, it } from "vitest";
import { wakeAfterCommit } from "../../lib/db/wake";

function recorder() {
  const sent: { at: number; params: unknown[] }[] = [];
  // a pooled node-postgres connection, as knex's client hands it out
  const pooled = {
    query: async ({ values }: { values: unknown[] }) => {
      sent.push({ at: performance.now(), params: values });
      return { rows: [] };
    },
  };
  const knex = { client: { acquireConnection: async () => pooled, releaseConnection: async () => undefined } };
  const connection = { getKnex: () => knex };
  return { sent, em: { getConnection: () => connection } as unknown as EntityManager };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
/** the end of this moment: wake-ups sent "at once" go out before it */
const nextMoment = () => new Promise((resolve) => setImmediate(resolve));

describe("wakeAfterCommit", () => {
  it("sends one wake-up for the calls of one moment, after it, on the channel asked for", async () => {
    const { sent, em } = recorder();
    for (let i = 0; i < 5; i++) wakeAfterCommit(em, "outbox", 1000);
    expect(sent).toHaveLength(0);
    await nextMoment();
    expect(sent.map((s) => s.params)).toEqual([["outbox"]]);
  });

  it("holds a wake-up asked for within the interval until the interval has passed, and then sends it", async () => {
    const { sent, em } = recorder();
    wakeAfterCommit(em, "outbox", 300);
    await nextMoment();
    wakeAfterCommit(em, "outbox", 300);
    wakeAfterCommit(em, "outbox", 300);
    await nextMoment();
    expect(sent).toHaveLength(1);
    await sleep(400);
    expect(sent).toHaveLength(2);
    expect(sent[1].at - sent[0].at).toBeGreaterThanOrEqual(298);
  });

  it("under a stream of calls never wakes twice within the interval, and never drops the last call", async () => {
    const { sent, em } = recorder();
    const started = performance.now();
    let lastCall = started;
    while (performance.now() - started < 200) {
      wakeAfterCommit(em, "outbox", 50);
      lastCall = performance.now();
      await sleep(2);
    }
    await sleep(120);
    for (let i = 1; i < sent.length; i++) expect(sent[i].at - sent[i - 1].at).toBeGreaterThanOrEqual(48); // timers keep whole milliseconds
    // at most one wake-up per (whole-millisecond) interval while calls come, and the last one after them
    expect(sent.length).toBeLessThanOrEqual(Math.floor((lastCall - started) / 48) + 2);
    expect(sent.at(-1)!.at).toBeGreaterThanOrEqual(lastCall);
  });

  it("after a quiet spell wakes at once, and keeps channels and connections apart", async () => {
    const { sent, em } = recorder();
    const other = recorder();
    wakeAfterCommit(em, "outbox", 50);
    await sleep(80);
    wakeAfterCommit(em, "outbox", 50);
    wakeAfterCommit(em, "released", 50);
    wakeAfterCommit(other.em, "outbox", 50);
    await nextMoment();
    expect(sent.map((s) => s.params)).toEqual([["outbox"], ["outbox"], ["released"]]);
    expect(other.sent.map((s) => s.params)).toEqual([["outbox"]]);
  });
});
