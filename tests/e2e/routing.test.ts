/**
 * A program stored without a shear shows, on its console page, every active shear the hub
 * checked, the one chosen and why each other was not.
 */
import path from "node:path";
import type { Browser } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, SCREENSHOTS } from "../support/browser";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  exampleProgram,
  TEST_PASSWORD,
  TEST_SHEAR,
  type TestShop,
} from "../support/fixtures";

let browser: Browser;
let shop: TestShop;

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("routing-page");
});
afterAll(async () => {
  await browser?.close();
  await closeTestOrm();
});

describe("a routed program's page", () => {
  it("names the shear chosen and why the others were not", async () => {
    const auth = { Authorization: `Bearer ${shop.key}` };
    // an invented light shear rated for 1.5 mm: 10 ga A36 is beyond it
    await request(BASE_URL)
      .post("/api/v1/shears")
      .set(auth)
      .send({ ...TEST_SHEAR, name: "Light shear", ratedThicknessMm: 1.5 })
      .expect(201);
    const { shear: _named, ...unrouted } = exampleProgram("");
    const program = (await request(BASE_URL).post("/api/v1/programs").set(auth).send(unrouted).expect(201)).body;
    expect(program.shear).toBe(shop.shearId);

    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await page.goto(`${BASE_URL}/signin`);
    await page.getByLabel("E-mail").fill(shop.viewer);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE_URL}/console`);
    await page.goto(`${BASE_URL}/console/programs/${program.id}`);
    const routing = page.getByTestId("routing");
    await routing.waitFor();
    expect(await routing.getByRole("row").filter({ hasText: "Test shear (chosen)" }).count()).toBe(1);
    const light = routing.getByRole("row").filter({ hasText: "Light shear" });
    expect(await light.getByRole("cell").nth(1).textContent()).toBe("no"); // can it cut?
    const reason = program.routing.shears.find((s: { name: string }) => s.name === "Light shear").reason;
    expect(await light.textContent()).toContain(reason);
    expect(await page.getByRole("note", { name: "Safety" }).count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, "console-program-routed.png"), fullPage: true });
    await page.close();
  });

  it("lets a console plan leave the shear to the shop's rule, and says which it chose", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await page.goto(`${BASE_URL}/signin`);
    await page.getByLabel("E-mail").fill(shop.admins[0]);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE_URL}/console`);
    await page.goto(`${BASE_URL}/console/plans/new`);
    await page.getByLabel("Reference").fill("E2E-ROUTED");
    await page.getByLabel("Shear").selectOption({ label: "Any shear: the shop's rule chooses" });
    await page.getByLabel("Thickness", { exact: true }).fill("3");
    const csv = "label,length,width,quantity,can_turn\nbase,600,400,4,yes\n";
    await page.setInputFiles("input[type=file]", { name: "cut.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
    await page.getByRole("button", { name: "Plan", exact: true }).click();
    await page.waitForURL(/\/console\/plans\/pln_/);
    const routing = page.getByTestId("routing");
    await routing.waitFor();
    expect(await routing.getByRole("row").filter({ hasText: "(chosen)" }).count()).toBe(1);
    const light = routing.getByRole("row").filter({ hasText: "Light shear" });
    expect(await light.getByRole("cell").nth(1).textContent()).toBe("no"); // can it cut?
    await page.close();
  });

  it("lets an admin change the routing rule and the remnant size on the Shears page", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await page.goto(`${BASE_URL}/signin`);
    await page.getByLabel("E-mail").fill(shop.admins[1]);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE_URL}/console`);
    await page.goto(`${BASE_URL}/console/shears`);
    const form = page.locator("section", { has: page.getByRole("heading", { name: "Routing and remnants" }) });
    await form.getByLabel(/Keep offcuts as remnants/).fill("-5");
    await form.getByRole("button", { name: "Save settings" }).click();
    await form.getByRole("alert").first().waitFor(); // a negative size is refused by the API's schema
    await form.getByLabel("Work without a shear goes to").selectOption("shortest_queue");
    await form.getByLabel(/Keep offcuts as remnants/).fill("250");
    await form.getByRole("button", { name: "Save settings" }).click();
    await form.getByText("Settings saved.").waitFor();
    const read = await request(BASE_URL)
      .get("/api/v1/settings")
      .set({ Authorization: `Bearer ${shop.key}` });
    expect(read.body).toEqual({ routingRule: "shortest_queue", remnantMinMm: 250 });
    await page.close();
  });
});
