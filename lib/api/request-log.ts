/**
 * Request-log rows are buffered and written in batches (one multi-row INSERT every 250 ms or
 * 200 rows) so logging costs no database round trip on the request's own path. The buffer
 * is flushed when the process stops (by its host, when the host handles the stop signal itself);
 * rows are lost only if the process is killed outright.
 * Caller-chosen text (the path, the Idempotency-Key) is cut to a bounded length first, and a
 * batch the database refuses is written again row by row, so one bad row never costs the others.
 */
import { RequestLog } from "../../entities";
import { getOrm } from "../db/orm";
import { onStop, shutdownOwnedByHost } from "../shutdown";

export interface RequestLogRow {
  id: string;
  shopId: string | null;
  keyId: string | null;
  method: string;
  route: string;
  path: string;
  status: number;
  latencyMs: number;
  idempotencyKey: string | null;
  errorType: string | null;
  createdAt: Date;
}

const FLUSH_MS = 250;
const MAX_ROWS = 200;

type State = { rows: RequestLogRow[]; timer?: NodeJS.Timeout; writing: Promise<void>; hooked?: boolean };
const holder = globalThis as unknown as { __shearwireRequestLog?: State };
const state: State = (holder.__shearwireRequestLog ??= { rows: [], writing: Promise.resolve() });

/** Longest path and Idempotency-Key kept in the log (a longer one is cut, marked with an ellipsis). */
export const LOGGED_TEXT_MAX = 1000;
const cut = (text: string) => (text.length > LOGGED_TEXT_MAX ? `${text.slice(0, LOGGED_TEXT_MAX - 1)}…` : text);

export function logRequest(row: RequestLogRow) {
  state.rows.push({
    ...row,
    path: cut(row.path),
    idempotencyKey: row.idempotencyKey === null ? null : cut(row.idempotencyKey),
  });
  if (!state.hooked) {
    state.hooked = true;
    process.once("beforeExit", () => void flushRequestLog());
    // A host that owns the shutdown (the web server: it stops taking requests, lets those in flight finish, then runs
    // the stop hooks and exits) flushes the log last; stopping the process here would cut those requests off.
    onStop(flushRequestLog);
    for (const sig of ["SIGTERM", "SIGINT"] as const) {
      process.once(sig, () => {
        if (!shutdownOwnedByHost()) void flushRequestLog().finally(() => process.kill(process.pid, sig));
      });
    }
  }
  if (state.rows.length >= MAX_ROWS) void flushRequestLog();
  else state.timer ??= setTimeout(() => void flushRequestLog(), FLUSH_MS);
}

/** Write what is buffered now; resolves when it (and any write before it) is stored. */
export function flushRequestLog(): Promise<void> {
  if (state.timer) clearTimeout(state.timer);
  state.timer = undefined;
  const rows = state.rows.splice(0);
  if (rows.length) {
    state.writing = state.writing.then(async () => {
      const orm = await getOrm().catch((err) => {
        console.error(`[api] could not write ${rows.length} request-log rows:`, err);
        return null;
      });
      if (!orm) return;
      try {
        await orm.em.fork().insertMany(RequestLog, rows);
      } catch (err) {
        if (rows.length === 1) {
          console.error(`[api] could not write request-log row ${rows[0].id}:`, err);
          return;
        }
        // One bad row must not cost the others: write them one at a time, losing only what fails alone.
        let lost = 0;
        for (const row of rows) {
          await orm.em
            .fork()
            .insert(RequestLog, row)
            .catch((rowErr) => {
              lost += 1;
              console.error(`[api] could not write request-log row ${row.id}:`, rowErr);
            });
        }
        if (lost) console.error(`[api] ${lost} of ${rows.length} request-log rows could not be written`);
      }
    });
  }
  return state.writing;
}
