/**
 * Stopping the web server (`scripts/web-server.ts`) as a deployment does, with SIGTERM: a
 * gateway's long-polling claim is answered (204 at once) instead of cut off, the request log's
 * last rows are written, and the process exits by itself, well before the 5 s after which it
 * would close every connection. The request log once re-raised the signal as soon as its own
 * rows were written, which cut such requests off mid-answer ("socket hang up").
 */
import request from "supertest";
import { afterEach, describe, expect, it } from "vitest";
import { RequestLog } from "../../entities";
import { daemon, daemonPid, startWeb, stopDaemon, waitForHttp } from "../../scripts/lib/web";
import { profile, testAppEnv } from "../support/env";
import { closeTestOrm, createTestShop, keyFor, testOrm } from "../support/fixtures";

const PORT = 3104;
const base = `http://127.0.0.1:${PORT}`;
const web = daemon(profile.dataRoot, `web-stop-${PORT}`);

async function start() {
  await startWeb(web, PORT, testAppEnv());
  await waitForHttp(`${base}/api/v1/health`, web);
}

/** SIGTERM (then waits for the process to end; SIGKILL after 10 s): how long the process took to end, and its pid. */
async function stop() {
  const pid = daemonPid(web);
  const began = Date.now();
  expect(await stopDaemon(web)).toBe("stopped");
  return { took: Date.now() - began, pid: pid! };
}

const gone = (pid: number) => {
  try {
    process.kill(pid, 0);
    return false;
  } catch {
    return true;
  }
};

const logged = async (shopId: string, path: string) =>
  (await (await testOrm()).em.fork().find(RequestLog, { shopId, path })).map((row) => row.status);

afterEach(async () => {
  await stopDaemon(web);
});

describe("the web server, stopped with SIGTERM", () => {
  it("answers a long-polling claim at once, logs it, and exits by itself", async () => {
    await start();
    const shop = await createTestShop("stopping");
    const gateway = await keyFor(shop.shopId, ["gateway"]);
    const claim = request(base)
      .post(`/api/v1/shears/${shop.shearId}/claims`)
      .set({ Authorization: `Bearer ${gateway.secret}` })
      .send({ waitSeconds: 20 })
      .then((res) => ({ status: res.status, at: Date.now() }));
    await new Promise((resolve) => setTimeout(resolve, 1000)); // the claim is waiting now
    const stopping = Date.now();
    const stopped = stop();
    const answer = await claim;
    expect(answer.status).toBe(204); // answered, not cut off
    expect(answer.at - stopping).toBeLessThan(3000); // at once, not after its 20 s
    const { took, pid } = await stopped;
    expect(took).toBeLessThan(4500); // ended by itself, before the 5 s after which connections are closed
    expect(gone(pid)).toBe(true);
    expect(await logged(shop.shopId, `/api/v1/shears/${shop.shearId}/claims`)).toEqual([204]);
  }, 120_000);

  it("writes the request log's last rows before it exits", async () => {
    await start();
    const shop = await createTestShop("last-rows");
    await request(base)
      .get("/api/v1/shears")
      .set({ Authorization: `Bearer ${shop.key}` })
      .expect(200);
    // at once: the log writes its buffer every 250 ms, so this row is still buffered when the signal comes
    const { took } = await stop();
    expect(took).toBeLessThan(4500);
    expect(await logged(shop.shopId, "/api/v1/shears")).toEqual([200]);
    await closeTestOrm();
  }, 120_000);
});
