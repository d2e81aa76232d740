/**
 * Stopping a process that hosts the app (`scripts/web-server.ts`). The app's bundle and the
 * script hosting it load this module apart, so what they share lives on `globalThis`: whether
 * the host handles the stop signals itself, what must run before it exits (the request log's
 * last rows), and a signal aborted as stopping begins, which ends long waits (a gateway's claim)
 * with their answer instead of leaving them to be cut off.
 */
interface Shutdown {
  controller: AbortController;
  hooks: Set<() => Promise<void>>;
  owned: boolean;
}
const holder = globalThis as unknown as { __shearwireShutdown?: Shutdown };
const shared: Shutdown = (holder.__shearwireShutdown ??= {
  controller: new AbortController(),
  hooks: new Set(),
  owned: false,
});

/** Aborted once the host begins to stop. */
export const stoppingSignal: AbortSignal = shared.controller.signal;

/** For a host that handles SIGTERM and SIGINT itself and calls `beginStopping` and `runStopHooks` before it exits. */
export function hostOwnsShutdown(): void {
  shared.owned = true;
}

export function shutdownOwnedByHost(): boolean {
  return shared.owned;
}

/** Run `hook` before the process exits, when a host owns the shutdown. */
export function onStop(hook: () => Promise<void>): void {
  shared.hooks.add(hook);
}

/** Stopping has begun: long waits end now. */
export function beginStopping(): void {
  shared.controller.abort();
}

/** Every hook, each given at most `ms` (a database that does not answer must not hold the exit). */
export async function runStopHooks(ms: number): Promise<void> {
  const limit = new Promise<void>((resolve) => setTimeout(resolve, ms).unref());
  await Promise.race([Promise.allSettled([...shared.hooks].map((hook) => hook())), limit]);
}

/**
 * Run `stop` on the first SIGTERM or SIGINT; later ones change nothing (tsx, which runs the scripts,
 * may pass a signal on again a moment later, and with no listener left the process would end at once).
 */
export function onStopSignal(stop: (signal: NodeJS.Signals) => void): void {
  let stopping = false;
  for (const signal of ["SIGTERM", "SIGINT"] as const)
    process.on(signal, () => {
      if (stopping) return;
      stopping = true;
      stop(signal);
    });
}
