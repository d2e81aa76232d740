/**
 * Plans under real conditions: two workers share the planning queue and a plan is computed
 * once; a worker killed mid-plan leaves the plan to the other, which finishes it with the
 * same answer as an undisturbed run; and while the largest plan the limits allow runs, the
 * server keeps answering (health and a console page).
 */
import { readFileSync } from "node:fs";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Event } from "../../entities";
import { daemon, startWorker, stopDaemon } from "../../scripts/lib/web";
import { BASE_URL, profile, testAppEnv, WORKER_DAEMON } from "../support/env";
import { closeTestOrm, createTestShop, TEST_PASSWORD, testOrm, type TestShop } from "../support/fixtures";
import { largestOrder, mediumOrder } from "../../scripts/lib/orders";

let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
const second = daemon(profile.dataRoot, "worker-test-2");

beforeAll(async () => {
  shop = await createTestShop("plan-workers");
});
afterAll(async () => {
  await stopDaemon(second);
  const main = daemon(profile.dataRoot, WORKER_DAEMON);
  if (!readPid(main.pidFile)) startWorker(main, testAppEnv());
  await closeTestOrm();
});

function readPid(file: string): number | null {
  try {
    const pid = Number(readFileSync(file, "utf8"));
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

const read = (id: string) => api().get(`/api/v1/plans/${id}`).set(auth());

async function until(
  id: string,
  done: (body: { status: string; progress: { patterns: number } | null }) => boolean,
  seconds: number,
) {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    const res = await read(id);
    if (done(res.body)) return res.body;
    if (Date.now() > deadline) throw new Error(`plan ${id} still ${res.body.status} after ${seconds} s`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
const ended = (b: { status: string }) => !["queued", "running"].includes(b.status);

describe("two workers", () => {
  it("compute each plan once", async () => {
    startWorker(second, testAppEnv());
    const ids: string[] = [];
    for (let i = 0; i < 6; i++)
      ids.push(
        (
          await api()
            .post("/api/v1/plans")
            .set(auth())
            .send(mediumOrder(shop.shearId, 100 + i, 20))
        ).body.id,
      );
    for (const id of ids) {
      const plan = await until(id, ended, 120);
      expect(plan).toMatchObject({ status: "complete", attempts: 1 });
    }
    const events = await (await testOrm()).em.fork().find(Event, { subjectId: { $in: ids } });
    expect(events.map((e) => e.type).sort()).toEqual(ids.map(() => "plan.completed"));
    await stopDaemon(second);
  }, 240_000);

  it("finish a plan whose worker was killed mid-plan, with the same answer as an undisturbed run", async () => {
    const order = mediumOrder(shop.shearId, 42, 60);
    // The undisturbed run.
    const calm = await until((await api().post("/api/v1/plans").set(auth()).send(order)).body.id, ended, 120);
    expect(calm.status).toBe("complete");

    // The same order again: once the only worker is on it, a second one starts and the first is killed.
    const id = (await api().post("/api/v1/plans").set(auth()).send(order)).body.id;
    await until(id, (b) => b.status === "running" && (b.progress?.patterns ?? 0) >= 1, 60);
    startWorker(second, testAppEnv());
    const main = daemon(profile.dataRoot, WORKER_DAEMON);
    process.kill(-Number(readFileSync(main.pidFile, "utf8")), "SIGKILL"); // the whole process group, threads and all
    const finished = await until(id, ended, 150);
    expect(finished.status).toBe("complete");
    expect((finished as unknown as { attempts: number }).attempts).toBeGreaterThanOrEqual(2); // it really was taken over
    expect((finished as unknown as { result: unknown }).result).toEqual(
      (calm as unknown as { result: unknown }).result,
    );
    startWorker(main, testAppEnv());
    await stopDaemon(second);
  }, 360_000);
});

/** Sign in to the console over HTTP (next-auth's credentials flow) and return the session cookie. */
async function consoleCookie(email: string): Promise<string> {
  const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(";")[0]);
  const { csrfToken } = await csrf.json();
  const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Cookie: cookies.join("; ") },
    body: new URLSearchParams({ csrfToken, email, password: TEST_PASSWORD, json: "true" }),
  });
  const session = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .find((c) => c.includes("session-token"));
  if (!session) throw new Error(`sign-in failed: ${res.status}`);
  return [...cookies, session].join("; ");
}

describe("a server that never stalls", () => {
  it("answers 50 health requests and a console page while the largest plan the limits allow runs", async () => {
    const cookie = await consoleCookie(shop.admins[0]);
    const id = (await api().post("/api/v1/plans").set(auth()).send(largestOrder(shop.shearId))).body.id;
    await until(id, (b) => b.status === "running", 60);
    const started = performance.now();
    const timed = async (url: string, headers: Record<string, string> = {}) => {
      const t = performance.now();
      const res = await fetch(url, { headers });
      await res.arrayBuffer();
      return { status: res.status, ms: performance.now() - t };
    };
    const answers = await Promise.all([
      ...Array.from(
        { length: 50 },
        (_, i) =>
          new Promise<{ status: number; ms: number }>((resolve) =>
            setTimeout(() => resolve(timed(`${BASE_URL}/api/v1/health`)), i * 40),
          ),
      ),
      timed(`${BASE_URL}/console/plans/${id}`, { Cookie: cookie }),
    ]);
    const stillRunning = (await read(id)).body.status;
    console.log(
      `while a plan ran (${stillRunning} at the end): ${answers.length} requests in ${Math.round(performance.now() - started)} ms, worst ${Math.round(Math.max(...answers.map((a) => a.ms)))} ms`,
    );
    expect(answers.map((a) => a.status)).toEqual(answers.map(() => 200));
    await api().post(`/api/v1/plans/${id}/cancel`).set(auth()).send({});
  }, 120_000);
});
