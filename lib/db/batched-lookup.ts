/**
 * Concurrent lookups of the same kind share queries, without a cache: a lookup asked for while
 * fewer than `inFlight` queries run starts one at once; one asked for while they all run waits
 * for the next query, which starts as soon as one of them ends and answers every key that
 * waited. Every answer therefore comes from a query that started after it was asked for, so a
 * change committed before a request arrived (a revoked key, say) is always seen by it.
 */
export function batchedLookup<K, V>(
  load: (keys: K[]) => Promise<Map<K, V>>,
  { inFlight = 2, maxKeys = 500 } = {},
): (key: K) => Promise<V | undefined> {
  type Waiter = { resolve: (value: V | undefined) => void; reject: (reason: unknown) => void };
  let waiting = new Map<K, Waiter[]>();
  let running = 0;

  function start() {
    if (!waiting.size || running >= inFlight) return;
    let batch = waiting;
    if (batch.size > maxKeys) {
      const keys = [...batch.keys()].slice(0, maxKeys);
      batch = new Map(keys.map((k) => [k, waiting.get(k)!]));
      for (const k of keys) waiting.delete(k);
    } else waiting = new Map();
    running += 1;
    load([...batch.keys()])
      .then(
        (found) => batch.forEach((ws, k) => ws.forEach((w) => w.resolve(found.get(k)))),
        (err) => batch.forEach((ws) => ws.forEach((w) => w.reject(err))),
      )
      .finally(() => {
        running -= 1;
        start();
      });
    start();
  }

  return (key: K) =>
    new Promise<V | undefined>((resolve, reject) => {
      const ws = waiting.get(key);
      if (ws) ws.push({ resolve, reject });
      else waiting.set(key, [{ resolve, reject }]);
      start();
    });
}
