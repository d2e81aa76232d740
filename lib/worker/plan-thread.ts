/**
 * A worker thread that plans one order: the CPU-heavy part runs here, so the worker's own
 * event loop (leases, webhook deliveries, the queue's locks) never waits for it. It reports
 * progress after every sheet pattern and posts the answer; the worker ends it early (cancel,
 * time limit) by terminating it.
 */
import { parentPort, workerData } from "node:worker_threads";
import { planOrder, type Order } from "../planner/order";
import { type PlanContext } from "../planner/planned";

export type ThreadMessage =
  | { kind: "progress"; progress: { patterns: number; piecesPlaced: number; piecesWanted: number } }
  | { kind: "result"; result: unknown }
  | { kind: "error"; message: string; refused?: { limit: string; pointer: string; value: number; max: number | null } };

const { order, context } = workerData as { order: Order; context: PlanContext };
const post = (message: ThreadMessage) => parentPort!.postMessage(message);

try {
  const result = await planOrder(order, context, (progress) => post({ kind: "progress", progress }));
  post({ kind: "result", result });
} catch (err) {
  const refused =
    err && typeof err === "object" && "limit" in err
      ? (err as { limit: string; pointer: string; value: number; max: number | null })
      : undefined;
  post({
    kind: "error",
    message: (err as Error).message,
    refused: refused && { limit: refused.limit, pointer: refused.pointer, value: refused.value, max: refused.max },
  });
}
