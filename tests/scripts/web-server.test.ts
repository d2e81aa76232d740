/**
 * Stopping the web server (`scripts/web-server.ts`) as a deployment does, with SIGTERM, while a
 * gateway's long-polling claim is in flight: the claim is answered, the request log keeps its row,
 * and the process exits. The request log once re-raised the signal as soon as its own rows were
 * written, which cut such requests off mid-answer.
 */
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { RequestLog } from "../../entities";
import { daemon, daemonPid, startWeb, stopDaemon, waitForHttp } from "../../scripts/lib/web";
import { profile, testAppEnv } from "../support/env";
import { closeTestOrm, createTestShop, keyFor, testOrm } from "../support/fixtures";

const PORT = 3104;
const base = `http://127.0.0.1:${PORT}`;
const web = daemon(profile.dataRoot, `web-stop-${PORT}`);

beforeAll(async () => {
  await startWeb(web, PORT, testAppEnv());
  await waitForHttp(`${base}/api/v1/health`, web);
}, 180_000);

afterAll(async () => {
  await stopDaemon(web);
  await closeTestOrm();
});

describe("the web server, stopped with SIGTERM", () => {
  it("answers the requests in flight, writes their log rows, then exits", async () => {
    const shop = await createTestShop("stopping");
    const gateway = await keyFor(shop.shopId, ["gateway"]);
    // a request already logged, so the request log's buffer (and its own stop handling) is in place
    await request(base)
      .get("/api/v1/shears")
      .set({ Authorization: `Bearer ${shop.key}` })
      .expect(200);
    const started = Date.now();
    const claim = request(base)
      .post(`/api/v1/shears/${shop.shearId}/claims`)
      .set({ Authorization: `Bearer ${gateway.secret}` })
      .send({ waitSeconds: 2 })
      .then((res) => res);
    await new Promise((resolve) => setTimeout(resolve, 500)); // the claim is waiting now
    const pid = daemonPid(web);
    const stopping = Date.now();
    const stopped = stopDaemon(web); // SIGTERM, then waits for the process to end (SIGKILL after 10 s)
    const answer = await claim;
    expect(answer.status).toBe(204); // nothing to claim: answered after its wait, not cut off
    expect(Date.now() - started).toBeGreaterThanOrEqual(2000);
    expect(await stopped).toBe("stopped");
    expect(Date.now() - stopping).toBeLessThan(9000); // it ended by itself, well before the SIGKILL
    expect(() => process.kill(pid!, 0)).toThrow(); // gone
    const rows = await (
      await testOrm()
    ).em
      .fork()
      .find(RequestLog, { keyId: gateway.key.id, status: 204 }, { orderBy: { createdAt: "desc" } });
    expect(rows.map((row) => row.path)).toContain(`/api/v1/shears/${shop.shearId}/claims`);
  }, 60_000);
});
