/**
 * A statement run as a named prepared statement: PostgreSQL parses and plans it once per
 * connection instead of on every call (node-postgres keeps the name per connection). For the
 * few fixed, hot statements whose planning is a real share of their cost; the text under one
 * name must never change. Runs in the entity manager's transaction when it has one.
 */
import type { EntityManager } from "@mikro-orm/postgresql";

export async function runPrepared<Row = Record<string, unknown>>(
  em: EntityManager,
  name: string,
  sql: string,
  bindings: readonly (string | number | boolean | Date | null)[],
): Promise<Row[]> {
  const query = em
    .getConnection()
    .getKnex()
    .raw(sql, bindings)
    // knex hands these options to node-postgres's query config
    .options({ name: `shearwire.${name}` });
  const transaction = em.getTransactionContext();
  if (transaction) query.transacting(transaction);
  return ((await query) as unknown as { rows: Row[] }).rows;
}
