/**
 * Request-log rows are buffered and written in batches (one multi-row INSERT every 250 ms or
 * 200 rows) so logging costs no database round trip on the request's own path. The buffer
 * is flushed when the process stops; rows are lost only if the process is killed outright.
 */
import { RequestLog } from "../../entities";
import { getOrm } from "../db/orm";

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

export function logRequest(row: RequestLogRow) {
  state.rows.push(row);
  if (!state.hooked) {
    state.hooked = true;
    process.once("beforeExit", () => void flushRequestLog());
    for (const sig of ["SIGTERM", "SIGINT"] as const) {
      process.once(sig, () => void flushRequestLog().finally(() => process.kill(process.pid, sig)));
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
      try {
        await (await getOrm()).em.fork().insertMany(RequestLog, rows);
      } catch (err) {
        console.error(`[api] could not write ${rows.length} request-log rows:`, err);
      }
    });
  }
  return state.writing;
}
