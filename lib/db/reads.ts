/**
 * Several reads through one entity manager. Outside a transaction each read takes its own pooled
 * connection, so they run at once; inside one they share the transaction's single connection,
 * which takes one query at a time (node-postgres queues a query sent while another runs, a use it
 * has deprecated and its next major version refuses), so they run one after another.
 */
import type { EntityManager } from "@mikro-orm/postgresql";

export async function readsOf<T extends readonly unknown[]>(
  em: EntityManager,
  ...reads: { [K in keyof T]: () => Promise<T[K]> }
): Promise<T> {
  if (!em.isInTransaction()) return (await Promise.all(reads.map((read) => read()))) as unknown as T;
  const results: unknown[] = [];
  for (const read of reads) results.push(await read());
  return results as unknown as T;
}
