/**
 * Wake-ups sent after a commit rather than inside the transaction: NOTIFY inside a transaction
 * makes every committing writer queue for PostgreSQL's one notification lock, and a process
 * committing hundreds of changes a second needs only one wake-up per moment. Calls made while
 * a wake-up is pending for the channel share it. A wake-up is a hint: whoever listens also
 * looks for work on a timer, so one lost to a crash costs a short delay, never the work.
 */
import type { EntityManager } from "@mikro-orm/postgresql";

/** Channels with a wake-up pending, per database connection (the one that wrote the change). */
const pending = new WeakMap<object, Set<string>>();

export function wakeAfterCommit(em: EntityManager, channel: string): void {
  const connection = em.getConnection();
  let channels = pending.get(connection);
  if (!channels) pending.set(connection, (channels = new Set()));
  if (channels.has(channel)) return;
  channels.add(channel);
  setImmediate(() => {
    channels.delete(channel);
    connection
      .execute(`select pg_notify(?, '')`, [channel])
      .catch((err) => console.error(`[wake] could not notify ${channel}:`, err));
  });
}
