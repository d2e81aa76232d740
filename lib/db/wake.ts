/**
 * Wake-ups sent after a commit rather than inside the transaction: NOTIFY inside a transaction
 * makes every committing writer queue for PostgreSQL's one notification lock, and a process
 * committing hundreds of changes a second needs only one wake-up per moment. Calls made while
 * a wake-up is pending for the channel share it, and a channel is woken at most once per
 * `WAKE_INTERVAL_MS` (the first wake-up after a quiet spell goes at once; under a stream of
 * commits the listener, which itself starts a round at most that often, is not woken for
 * nothing). A wake-up is a hint: whoever listens also looks for work on a timer, so one lost
 * to a crash costs a short delay, never the work.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { runPrepared } from "./prepared";

const WAKE_INTERVAL_MS = 10;

interface Channel {
  pending: boolean;
  lastSent: number;
}

/** Each channel's wake-ups, per database connection (the one that wrote the change). */
const channelsOf = new WeakMap<object, Map<string, Channel>>();

export function wakeAfterCommit(em: EntityManager, channel: string, intervalMs = WAKE_INTERVAL_MS): void {
  const connection = em.getConnection();
  let channels = channelsOf.get(connection);
  if (!channels) channelsOf.set(connection, (channels = new Map()));
  let state = channels.get(channel);
  if (!state) channels.set(channel, (state = { pending: false, lastSent: -Infinity }));
  if (state.pending) return;
  state.pending = true;
  const wake = state;
  const send = () => {
    wake.pending = false;
    wake.lastSent = performance.now();
    runPrepared(connection.getKnex(), "wake", "select pg_notify($1, '')", [channel]).catch((err) =>
      console.error(`[wake] could not notify ${channel}:`, err),
    );
  };
  const wait = wake.lastSent + intervalMs - performance.now();
  if (wait > 0) setTimeout(send, Math.ceil(wait));
  else setImmediate(send);
}
