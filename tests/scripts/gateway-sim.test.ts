import { spawn, type ChildProcess } from "node:child_process";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";
import { Program } from "../../entities";
import { createProgram, releaseProgram } from "../../lib/services/programs";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, exampleProgram, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

function sim(shearId: string, key: string, speed: string, state: string): ChildProcess & { out: string } {
  const child = spawn(
    "node_modules/.bin/tsx",
    [
      "scripts/gateway-sim.ts",
      "--shear",
      shearId,
      "--key",
      key,
      "--url",
      BASE_URL,
      "--speed",
      speed,
      "--once",
      "--lease",
      "10",
      "--state",
      state,
    ],
    {
      stdio: ["ignore", "pipe", "pipe"],
    },
  ) as ChildProcess & { out: string };
  child.out = "";
  child.stdout!.on("data", (d) => (child.out += d));
  child.stderr!.on("data", (d) => (child.out += d));
  return child;
}

async function releasedProgram() {
  const shop = await createTestShop("sim");
  const em = (await testOrm()).em.fork();
  const p = await createProgram(em, shop.shopId, exampleProgram(shop.shearId));
  await releaseProgram(em.fork(), shop.shopId, p.id);
  return { shop, id: p.id };
}

const row = async (id: string) =>
  (await testOrm()).em.fork().findOneOrFail(Program, { id }, { disableIdentityMap: true });
const exited = (c: ChildProcess) => new Promise((r) => c.once("exit", r));

describe("npm run gateway:sim", () => {
  it("claims a released program, runs it with progress reports and completes it", async () => {
    const { shop, id } = await releasedProgram();
    const child = sim(shop.shearId, shop.key, "200", path.join(os.tmpdir(), `sim-${id}.json`));
    await exited(child);
    const p = await row(id);
    expect(p.status, child.out).toBe("completed");
    expect(p.outcome).toMatchObject({ goodPieces: 56, scrappedPieces: 0 });
    expect(p.progress).toMatchObject({ groupsDone: 4 }); // 2 groups × 2 sheets
  }, 60_000);

  it("picks up its program again after being stopped and started", async () => {
    const { shop, id } = await releasedProgram();
    const state = path.join(os.tmpdir(), `sim-${id}.json`);
    // about 168 s of work at ×20 ≈ 8 s: stop it once it is running
    const first = sim(shop.shearId, shop.key, "20", state);
    await vi.waitFor(async () => expect((await row(id)).status).toBe("running"), { timeout: 20_000, interval: 100 });
    first.kill("SIGINT");
    await exited(first);
    expect(first.out).toMatch(/SIGINT: stopping/);
    const second = sim(shop.shearId, shop.key, "200", state);
    await exited(second);
    expect(second.out, second.out).toMatch(/resuming/);
    const p = await row(id);
    expect(p.status).toBe("completed");
    expect(p.leaseExpiries).toBe(0); // it never lost the lease
  }, 90_000);
});
