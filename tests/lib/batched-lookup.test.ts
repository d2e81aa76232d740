/**
 * Shared lookups without a cache: lookups that arrive while queries run wait for the next
 * query and share it, and every answer comes from a query that started after it was asked
 * for, so a change made before a lookup is always seen by it (a revoked key on the next request).
 */
import { describe, expect, it } from "vitest";
import { batchedLookup } from "../../lib/db/batched-lookup";

/** A store whose queries the test finishes by hand, recording the keys of each. */
function store() {
  const values = new Map<string, string>();
  const queries: { keys: string[]; finish: () => void }[] = [];
  const load = (keys: string[]) =>
    new Promise<Map<string, string>>((resolve) => {
      const snapshot = new Map(keys.flatMap((k) => (values.has(k) ? [[k, values.get(k)!] as const] : [])));
      queries.push({ keys, finish: () => resolve(snapshot) });
    });
  return { values, queries, load };
}

const tick = () => new Promise((r) => setImmediate(r));

describe("batchedLookup", () => {
  it("starts at once while under its limit, then gathers what arrives into the next query", async () => {
    const s = store();
    s.values.set("a", "A").set("b", "B");
    const lookup = batchedLookup(s.load, { inFlight: 1 });
    const first = lookup("a");
    const waiting = [lookup("a"), lookup("b"), lookup("a"), lookup("c")];
    expect(s.queries.map((q) => q.keys)).toEqual([["a"]]);
    s.queries[0].finish();
    await tick();
    expect(s.queries.map((q) => q.keys)).toEqual([["a"], ["a", "b", "c"]]);
    s.queries[1].finish();
    expect(await first).toBe("A");
    expect(await Promise.all(waiting)).toEqual(["A", "B", "A", undefined]);
  });

  it("never answers from a query that began before the lookup was asked for", async () => {
    const s = store();
    s.values.set("key", "active");
    const lookup = batchedLookup(s.load, { inFlight: 2 });
    const before = lookup("key"); // its query reads "active" and is still running
    s.values.set("key", "revoked"); // the change commits
    const after = lookup("key"); // asked for after the change: a new query, not the one in flight
    expect(s.queries).toHaveLength(2);
    s.queries.forEach((q) => q.finish());
    expect(await before).toBe("active");
    expect(await after).toBe("revoked");
  });

  it("keeps to its limit of queries at a time under many lookups, and passes errors to each waiter", async () => {
    let running = 0;
    let most = 0;
    let count = 0;
    const lookup = batchedLookup(
      async (keys: number[]) => {
        running += 1;
        count += 1;
        most = Math.max(most, running);
        await tick();
        running -= 1;
        if (keys.includes(13)) throw new Error("unlucky");
        return new Map(keys.map((k) => [k, k * 2]));
      },
      { inFlight: 2 },
    );
    const answers = await Promise.allSettled(Array.from({ length: 200 }, (_, i) => lookup(i % 50)));
    expect(most).toBe(2);
    expect(count).toBeLessThanOrEqual(4);
    answers.forEach((a, i) => {
      if (i % 50 === 13) expect(a.status).toBe("rejected");
    });
    const fulfilled = answers.flatMap((a, i) => (a.status === "fulfilled" ? [[i, a.value] as const] : []));
    expect(fulfilled.every(([i, v]) => v === (i % 50) * 2)).toBe(true);
  });
});
