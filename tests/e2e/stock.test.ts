/**
 * The Stock page in headless Chromium: an admin adds sheets and a remnant, filters by grade,
 * thickness and kind, and adjusts a count with a reason; a viewer sees the stock but no forms,
 * and the server refuses the viewer's adjustment all the same.
 */
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, SCREENSHOTS } from "../support/browser";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop, TEST_PASSWORD, type TestShop } from "../support/fixtures";

let browser: Browser;
let shop: TestShop;

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("stock-page");
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

const rows = (page: Page) => page.getByTestId("stock-row");

describe("the Stock page", () => {
  it("adds, filters and adjusts stock for an admin", async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await signIn(page, shop.admins[1]);
    await page.getByRole("navigation", { name: "Console" }).getByRole("link", { name: "Stock" }).click();
    await page.waitForURL(`${BASE_URL}/console/stock`);
    await page.getByText("No stock matches.").waitFor();

    const form = page.locator("section", { has: page.getByRole("heading", { name: "Add stock" }) });
    const add = async (values: Record<string, string>, kind = "sheet", grade = "A36") => {
      await form.getByLabel("Kind").selectOption(kind);
      await form.getByLabel("Grade").selectOption(grade);
      for (const [label, value] of Object.entries(values)) await form.getByLabel(label).fill(value);
      await form.getByRole("button", { name: "Add stock" }).click();
    };
    // one at a time: a form is cleared when its action succeeds
    await add({ "Thickness (mm)": "3", Quantity: "12", "Length (mm)": "2500", "Width (mm)": "1250", Location: "B2" });
    await expect.poll(() => rows(page).count()).toBe(1);
    await add(
      { "Thickness (mm)": "3", Quantity: "1", "Length (mm)": "900", "Width (mm)": "600", Location: "R1" },
      "remnant",
    );
    await expect.poll(() => rows(page).count()).toBe(2);
    await add(
      { "Thickness (mm)": "6", Quantity: "4", "Length (mm)": "3000", "Width (mm)": "1500", Location: "C1" },
      "sheet",
      "304",
    );
    await expect.poll(() => rows(page).count()).toBe(3);
    // the API's own schema refuses a bad size in the form too, and nothing is added
    await add({ "Thickness (mm)": "0", Quantity: "1", "Length (mm)": "1", "Width (mm)": "1", Location: "x" });
    await form.getByRole("alert").first().waitFor();
    expect(await rows(page).count()).toBe(3);

    await page.getByRole("form", { name: "Filter stock" }).getByLabel("Grade").selectOption("A36");
    await page.getByRole("button", { name: "Filter" }).click();
    await page.waitForURL(/grade=A36/);
    await expect.poll(() => rows(page).count()).toBe(2);
    await page.getByRole("form", { name: "Filter stock" }).getByLabel("Kind").selectOption("remnant");
    await page.getByRole("button", { name: "Filter" }).click();
    await page.waitForURL(/kind=remnant/);
    await expect.poll(() => rows(page).count()).toBe(1);
    await page.goto(`${BASE_URL}/console/stock?thickness=6`);
    await expect.poll(() => rows(page).count()).toBe(1);
    await expect.poll(() => rows(page).first().textContent()).toContain("304");

    await page.goto(`${BASE_URL}/console/stock?grade=A36&kind=sheet`);
    const row = rows(page).first();
    await row.getByLabel(/^Change for/).fill("-2");
    await row.getByLabel(/^Reason for/).fill("two dented in handling");
    await row.getByRole("button", { name: "Adjust" }).click();
    await row.getByText("Now 10 on hand.").waitFor();
    await page.screenshot({ path: path.join(SCREENSHOTS, "console-stock.png"), fullPage: true });
    const api = await request(BASE_URL)
      .get("/api/v1/stock?grade=A36&kind=sheet")
      .set("Authorization", `Bearer ${shop.key}`);
    expect(api.body.data[0]).toMatchObject({ quantity: 10, location: "B2" });
    await page.close();
  });

  it("shows a viewer the stock without forms, and the server refuses a viewer's change", async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    // An admin opens the page and starts an adjustment…
    await signIn(page, shop.admins[1]);
    await page.goto(`${BASE_URL}/console/stock?grade=A36&kind=sheet`);
    const row = rows(page).first();
    await row.getByLabel(/^Change for/).fill("5");
    await row.getByLabel(/^Reason for/).fill("a viewer tries");
    // …then, in the same browser, the session becomes a viewer's, who sees no forms.
    const other = await context.newPage();
    await other.goto(`${BASE_URL}/console`);
    await other.getByRole("button", { name: "Sign out" }).click();
    await other.waitForURL(/\/signin/);
    await signIn(other, shop.viewer);
    await other.goto(`${BASE_URL}/console/stock`);
    await rows(other).first().waitFor();
    expect(await other.getByRole("heading", { name: "Add stock" }).count()).toBe(0);
    expect(await other.getByRole("button", { name: "Adjust" }).count()).toBe(0);
    // The stale form is sent with the viewer's session: the server says no and changes nothing.
    await row.getByRole("button", { name: "Adjust" }).click();
    await row.getByRole("alert").filter({ hasText: "viewer" }).waitFor();
    const api = await request(BASE_URL)
      .get("/api/v1/stock?grade=A36&kind=sheet")
      .set("Authorization", `Bearer ${shop.key}`);
    expect(api.body.data[0].quantity).toBe(10);
    await context.close();
  });
});
