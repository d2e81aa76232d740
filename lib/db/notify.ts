/**
 * PostgreSQL notifications, heard once per process: one connection LISTENs, and any number of
 * waiters (long-polling gateways, say) wait for a channel and payload instead of asking the
 * database again and again. NOTIFY is delivered on commit only, so a waiter wakes for work
 * that is really there. A waiter always has a timeout: a lost connection costs a slow poll,
 * never a hung request.
 */
import pg from "pg";
import { DEFAULT_DATABASE_URL } from "./config";

type Waiter = () => void;

interface Listener {
  client: Promise<pg.Client> | null;
  channels: Set<string>;
  waiters: Map<string, Set<Waiter>>;
}

const holder = globalThis as unknown as { __shearwireNotify?: Listener };
const state: Listener = (holder.__shearwireNotify ??= { client: null, channels: new Set(), waiters: new Map() });

const keyOf = (channel: string, payload: string) => `${channel}\u0001${payload}`;

function wake(channel: string, payload: string) {
  const waiters = state.waiters.get(keyOf(channel, payload));
  if (waiters) for (const waiter of [...waiters]) waiter();
}

async function connect(): Promise<pg.Client> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL });
  client.on("notification", (n) => wake(n.channel, n.payload ?? ""));
  const drop = () => {
    // Listen again on the next wait; waiters meanwhile end by their timeouts.
    if (state.client) state.client = null;
    client.removeAllListeners("notification");
  };
  client.on("error", drop);
  client.on("end", drop);
  await client.connect();
  for (const channel of state.channels) await client.query(`listen "${channel}"`);
  return client;
}

async function listening(channel: string): Promise<void> {
  const first = !state.channels.has(channel);
  state.channels.add(channel);
  if (!state.client) {
    state.client = connect().catch((err) => {
      state.client = null;
      throw err;
    });
    await state.client;
  } else if (first) {
    await (await state.client).query(`listen "${channel}"`);
  }
}

/**
 * Resolve true when `channel` is notified with `payload`, or false after `timeoutMs` (or when
 * `signal` aborts). Never throws: without a listening connection it simply waits out the time.
 */
export async function waitForNotification(
  channel: string,
  payload: string,
  timeoutMs: number,
  signal?: AbortSignal,
): Promise<boolean> {
  if (!/^[a-z_]+$/.test(channel)) throw new Error(`bad channel name ${channel}`);
  const key = keyOf(channel, payload);
  return new Promise<boolean>((resolve) => {
    const waiters = state.waiters.get(key) ?? new Set<Waiter>();
    state.waiters.set(key, waiters);
    const timers: { limit?: NodeJS.Timeout } = {};
    const finish = (notified: boolean) => {
      clearTimeout(timers.limit);
      signal?.removeEventListener("abort", onAbort);
      waiters.delete(waiter);
      if (!waiters.size) state.waiters.delete(key);
      resolve(notified);
    };
    const waiter = () => finish(true);
    const onAbort = () => finish(false);
    waiters.add(waiter);
    timers.limit = setTimeout(() => finish(false), timeoutMs);
    signal?.addEventListener("abort", onAbort, { once: true });
    listening(channel).catch(() => undefined);
  });
}
