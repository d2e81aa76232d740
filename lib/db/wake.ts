/**
 * Wake-ups sent after a commit rather than inside the transaction: NOTIFY inside a transaction
 * makes every committing writer queue for PostgreSQL's one notification lock, and a process
 * committing hundreds of changes a second needs only one wake-up per moment. Calls made while
 * a wake-up is pending for the channel share it. A wake-up is a hint: whoever listens also
 * looks for work on a timer, so one lost to a crash costs a short delay, never the work.
 */
import { getOrm } from "./orm";

const holder = globalThis as unknown as { __shearwireWake?: Set<string> };
const pending: Set<string> = (holder.__shearwireWake ??= new Set());

export function wakeAfterCommit(channel: string): void {
  if (pending.has(channel)) return;
  pending.add(channel);
  setImmediate(() => {
    pending.delete(channel);
    getOrm()
      .then((orm) => orm.em.getConnection().execute(`select pg_notify(?, '')`, [channel]))
      .catch((err) => console.error(`[wake] could not notify ${channel}:`, err));
  });
}
