/**
 * The route wrapper's turns for heavy requests (`lib/api/route.ts`): at most `HEAVY_CONCURRENCY`
 * run at once in one web server, the others wait in arrival order with their bodies already read,
 * light requests never wait behind them, and each heavy answer says how long it waited
 * (Server-Timing `queue`). Run in process against the wrapper itself, on operations of the test's own.
 */
import { afterEach, describe, expect, it } from "vitest";
import { z } from "zod";
import { defineOperation } from "../../lib/api/operation";
import { HEAVY_CONCURRENCY, route } from "../../lib/api/route";

const body = z.object({ n: z.number().int() });
const heavyOp = defineOperation({
  operationId: "testHeavy",
  heavy: true,
  method: "post",
  path: "/test-heavy",
  tags: ["Test"],
  scope: null,
  summary: "a heavy test operation",
  body,
  responses: { 200: { description: "done", schema: body } },
});
const lightOp = defineOperation({ ...heavyOp, operationId: "testLight", heavy: false, path: "/test-light" });

/** A handler that holds each request until the test lets it go, counting how many run at once. */
function heldHandler() {
  const state = { running: 0, most: 0, started: [] as number[], release: new Map<number, () => void>() };
  const handler = async ({ body: { n } }: { body: { n: number } }) => {
    state.running++;
    state.most = Math.max(state.most, state.running);
    state.started.push(n);
    await new Promise<void>((resolve) => state.release.set(n, resolve));
    state.running--;
    return { status: 200 as const, body: { n } };
  };
  return { state, handler };
}

const post = (path: string, n: number) =>
  new Request(`http://127.0.0.1/api/v1${path}`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ n }),
  });
const context = { params: Promise.resolve({}) };
const settle = async (until: () => boolean) => {
  for (let i = 0; i < 200 && !until(); i++) await new Promise((r) => setTimeout(r, 5));
};

let held: ReturnType<typeof heldHandler>["state"] | undefined;
afterEach(() => {
  // never leave a request of one test holding a turn in the next
  for (const release of held?.release.values() ?? []) release();
});

describe("heavy requests take turns", () => {
  it("runs at most HEAVY_CONCURRENCY at once, the rest in arrival order, each saying how long it waited", async () => {
    expect(HEAVY_CONCURRENCY).toBe(2); // the default, which the test environment does not change
    const { state, handler } = heldHandler();
    held = state;
    const handle = route(heavyOp, handler);
    const answers = [0, 1, 2, 3, 4].map((n) => handle(post("/test-heavy", n), context));
    await settle(() => state.started.length >= 2);
    await new Promise((r) => setTimeout(r, 30));
    expect(state.started).toEqual([0, 1]);

    // a light request is answered while both turns are taken
    const light = heldHandler();
    const lightAnswer = route(lightOp, light.handler)(post("/test-light", 9), context);
    await settle(() => light.state.started.length === 1);
    light.state.release.get(9)!();
    expect((await lightAnswer).status).toBe(200);

    // each released turn goes to the oldest waiting request
    state.release.get(1)!();
    await settle(() => state.started.length === 3);
    expect(state.started).toEqual([0, 1, 2]);
    expect(state.running).toBe(2);
    state.release.get(0)!();
    await settle(() => state.started.length === 4);
    state.release.get(2)!();
    await settle(() => state.started.length === 5);
    state.release.get(3)!();
    state.release.get(4)!();
    const done = await Promise.all(answers);
    expect(state.most).toBe(2);
    expect(state.started).toEqual([0, 1, 2, 3, 4]);
    expect(await Promise.all(done.map((r) => r.json()))).toEqual([0, 1, 2, 3, 4].map((n) => ({ n })));
    const waited = done.map((r) =>
      Number(/(?:^|, )queue;dur=([\d.]+)/.exec(r.headers.get("server-timing") ?? "")?.[1]),
    );
    expect(waited.every((ms) => Number.isFinite(ms))).toBe(true);
    expect(Math.min(...waited.slice(2))).toBeGreaterThanOrEqual(25); // they waited at least the 30 ms held above
  });

  it("reads a body before the turn: slow uploads hold none, a refused body runs nothing", async () => {
    const { state, handler } = heldHandler();
    held = state;
    const handle = route(heavyOp, handler);
    // two uploads that send part of their body and then stall
    const stalled = [0, 1].map(() => {
      let controller!: ReadableStreamDefaultController<Uint8Array>;
      const stream = new ReadableStream<Uint8Array>({ start: (c) => void (controller = c) });
      controller.enqueue(new TextEncoder().encode('{"n":'));
      const answer = handle(
        new Request("http://127.0.0.1/api/v1/test-heavy", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: stream,
          duplex: "half",
        } as RequestInit),
        context,
      );
      return { controller, answer };
    });
    const answer = handle(post("/test-heavy", 7), context);
    await settle(() => state.started.length === 1);
    expect(state.started).toEqual([7]);
    state.release.get(7)!();
    expect((await answer).status).toBe(200);

    // the stalled uploads end, one as JSON that does not parse: refused with a problem, no handler run
    stalled[0].controller.enqueue(new TextEncoder().encode("8}"));
    stalled[0].controller.close();
    stalled[1].controller.enqueue(new TextEncoder().encode("}"));
    stalled[1].controller.close();
    await settle(() => state.started.length === 2);
    state.release.get(8)!();
    const [ok, refused] = await Promise.all(stalled.map((s) => s.answer));
    expect(ok.status).toBe(200);
    expect(refused.status).toBe(400);
    expect(refused.headers.get("content-type")).toBe("application/problem+json");
    expect(state.started).toEqual([7, 8]);
  });
});
