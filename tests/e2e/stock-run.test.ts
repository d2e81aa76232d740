/**
 * Stock through a run, in headless Chromium with the reference gateway simulator: a plan drawn
 * from the shop's stock in the console cuts the remnant first; writing its programs reserves it;
 * once `npm run gateway:sim` has run the program, the Stock page shows the remnant booked out and
 * the offcut the run left booked in, naming the program.
 */
import { spawn } from "node:child_process";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, SCREENSHOTS } from "../support/browser";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, TEST_PASSWORD, type TestShop } from "../support/fixtures";

let browser: Browser;
let shop: TestShop;
const api = () => request(BASE_URL);
const auth = () => ({ Authorization: `Bearer ${shop.key}` });
let remnant: { id: string };

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("stock-run");
  // An invented rack: one 1000 × 600 mm remnant and four full sheets of 3 mm A36.
  const add = async (body: object) => (await api().post("/api/v1/stock").set(auth()).send(body).expect(201)).body;
  remnant = await add({ kind: "remnant", grade: "A36", thicknessMm: 3, lengthMm: 1000, widthMm: 600, quantity: 1 });
  await add({ kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 2500, widthMm: 1250, quantity: 4 });
  await api().patch("/api/v1/settings").set(auth()).send({ remnantMinMm: 200 }).expect(200);
});
afterAll(async () => {
  await browser?.close();
  await closeTestOrm();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${BASE_URL}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${BASE_URL}/console`);
}

/** `npm run gateway:sim` for the shop's shear, for one program; resolves with its output when it exits. */
function simulateOneRun(): Promise<{ code: number | null; out: string }> {
  const child = spawn(
    "node_modules/.bin/tsx",
    ["scripts/gateway-sim.ts", "--shear", shop.shearId, "--key", shop.key, "--url", BASE_URL, "--speed", "200"].concat([
      "--once",
      "--lease",
      "10",
      "--state",
      path.join(SCREENSHOTS, `..`, `sim-${shop.shearId}.json`),
    ]),
    { stdio: ["ignore", "pipe", "pipe"] },
  );
  let out = "";
  child.stdout.on("data", (d) => (out += d));
  child.stderr.on("data", (d) => (out += d));
  return new Promise((resolve) => child.once("exit", (code) => resolve({ code, out })));
}

const stockRow = (page: Page, text: string) => page.getByTestId("stock-row").filter({ hasText: text });

describe("stock through a run", () => {
  it("plans from stock, reserves on writing, and books the run's material after the simulator runs it", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await signIn(page, shop.admins[0]);
    await page.goto(`${BASE_URL}/console/plans/new`);
    await page.getByLabel("Reference").fill("E2E-STOCK");
    await page.getByLabel("Thickness", { exact: true }).fill("3");
    await page.getByLabel(/Plan on the shop's stock/).check();
    // two 450 × 280 mm brackets fit a remnant of 1000 × 600 mm with room to spare (2 × 450 = 900 ≤ 1000)
    const csv = "label,length,width,quantity,can_turn\nbracket,450,280,2,yes\n";
    await page.setInputFiles("input[type=file]", { name: "cut.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
    await page.getByRole("button", { name: "Plan", exact: true }).click();
    await page.waitForURL(/\/console\/plans\/pln_/);
    await page.getByTestId("pattern-A").waitFor();
    expect(await page.getByRole("note", { name: "Safety" }).count()).toBe(1);
    const planId = page.url().split("/").pop()!;
    const plan = (await api().get(`/api/v1/plans/${planId}`).set(auth())).body;
    expect(plan.result.stock[0]).toMatchObject({ item: remnant.id, remnant: true, used: 1 });
    expect(plan.result.stock[1]).toMatchObject({ remnant: false, used: 0 });
    await page.screenshot({ path: path.join(SCREENSHOTS, "console-plan-from-stock.png"), fullPage: true });

    await page.getByRole("button", { name: /Write \d+ draft program/ }).click();
    await page.getByTestId("plan-programs").waitFor();
    await page.goto(`${BASE_URL}/console/stock?kind=remnant`);
    await expect.poll(() => stockRow(page, "1000 × 600").textContent()).toMatch(/1\s*1\s*0/); // on hand 1, reserved 1, available 0

    // release the written program and let the simulated gateway run it
    const program = (await api().get(`/api/v1/plans/${planId}`).set(auth())).body.programs[0];
    const read = (await api().get(`/api/v1/programs/${program.id}`).set(auth())).body;
    const codes = [...new Set(read.check.findings.map((f: { code: string }) => f.code))];
    await api().post(`/api/v1/programs/${program.id}/release`).set(auth()).send({ acknowledge: codes }).expect(200);
    const sim = await simulateOneRun();
    expect(sim.code, sim.out).toBe(0);
    expect((await api().get(`/api/v1/programs/${program.id}`).set(auth())).body.status).toBe("completed");

    // the remnant is booked out; the offcut the plan said the pattern leaves (at least 200 mm both ways)
    // is booked in from the program's own check, naming the program
    const kept = (plan.result.patterns[0].offcuts as { length: number; width: number }[]).filter(
      (o) => Math.min(o.length, o.width) >= 200,
    );
    expect(kept).toHaveLength(1);
    const size = `${Math.max(kept[0].length, kept[0].width)} × ${Math.min(kept[0].length, kept[0].width)}`;
    await page.goto(`${BASE_URL}/console/stock?kind=remnant`);
    await expect.poll(() => stockRow(page, program.id).count()).toBe(1);
    expect(await stockRow(page, program.id).textContent()).toContain(size);
    await expect.poll(() => stockRow(page, "1000 × 600").textContent()).toMatch(/0\s*0\s*0/);
    await page.screenshot({ path: path.join(SCREENSHOTS, "console-stock-after-run.png"), fullPage: true });
    await page.close();
  });
});
