/**
 * The console as people use it, in headless Chromium: forms that keep what was typed, a
 * release that names the shear it goes to, a program with errors that says what to do, an
 * upload naming its shear by name, the attempts of a delivery with what was sent and
 * received, paging past the first hundred programs, and a developer's own read-only key.
 */
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Membership, User } from "../../entities";
import { createProgram } from "../../lib/services/programs";
import { launch } from "../support/browser";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  exampleProgram,
  TEST_PASSWORD,
  testOrm,
  type TestShop,
} from "../support/fixtures";
import { startReceiver, type Receiver } from "../support/receiver";

let browser: Browser;
let shop: TestShop;
let receiver: Receiver;

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("workflows");
  receiver = await startReceiver();
});
afterAll(async () => {
  await browser?.close();
  await receiver?.close();
  await closeTestOrm();
});

async function signIn(email: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1400, height: 1000 } })).newPage();
  await page.goto(`${BASE_URL}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${BASE_URL}/console`);
  return page;
}

describe("forms", () => {
  it("keep what was typed when they are refused", async () => {
    const page = await signIn(shop.admins[0]);
    await page.goto(`${BASE_URL}/console/keys`);
    await page.getByLabel("Name").fill("Nightly export");
    await page.getByRole("button", { name: "Create key" }).click(); // no scope ticked
    await page
      .getByText(/at least one scope/i)
      .first()
      .waitFor();
    expect(await page.getByLabel("Name").inputValue()).toBe("Nightly export");

    await page.goto(`${BASE_URL}/console/webhooks`);
    await page.getByLabel("URL").fill("ftp://erp.example/hooks");
    await page.getByLabel("Description").fill("The ERP's receiver");
    await page.getByRole("button", { name: "Add endpoint" }).click();
    await page.locator("#endpoint-url-error").waitFor();
    expect(await page.getByLabel("URL").inputValue()).toBe("ftp://erp.example/hooks");
    expect(await page.getByLabel("Description").inputValue()).toBe("The ERP's receiver");
    await page.context().close();
  });
});

describe("programs", () => {
  it("asks before releasing, naming the shear, and a program with errors says how many and what to do", async () => {
    const em = (await testOrm()).em.fork();
    const good = await createProgram(em, shop.shopId, exampleProgram(shop.shearId));
    const bad = await createProgram(em.fork(), shop.shopId, {
      ...exampleProgram(shop.shearId),
      thickness: { value: 0.5 },
    }); // 12.7 mm: over the test shear's 6.35 mm
    expect(bad.validation).toBe("fail");
    const page = await signIn(shop.admins[0]);

    await page.goto(`${BASE_URL}/console/programs/${bad.id}`);
    const blocked = page.getByTestId("release-blocked");
    await blocked.waitFor();
    expect(await blocked.textContent()).toMatch(/Fix \d+ errors? to release/);
    expect(await page.getByTestId("program-where").textContent()).toMatch(/On Test shear · 0\.5 in A36/);

    await page.goto(`${BASE_URL}/console/programs/${good.id}`);
    let asked = "";
    page.once("dialog", (dialog) => {
      asked = dialog.message();
      void dialog.accept();
    });
    await page.getByRole("button", { name: "Release to Test shear" }).click();
    await page.getByText("Released: the gateway").waitFor();
    expect(asked).toMatch(/Release SO-.* to Test shear\?/);
    await page.context().close();
  });

  it("pages past the first hundred programs to the 101st", async () => {
    const own = await createTestShop("paging");
    const em = (await testOrm()).em.fork();
    const references: string[] = [];
    for (let i = 0; i < 101; i++) {
      const reference = `PAGE-${String(i).padStart(3, "0")}`;
      references.push(reference);
      await createProgram(em.fork(), own.shopId, exampleProgram(own.shearId, reference));
    }
    const page = await signIn(own.admins[0]);
    await page.goto(`${BASE_URL}/console/programs`);
    await page.getByTestId("program-row").first().waitFor();
    expect(await page.getByTestId("program-row").count()).toBe(50);
    for (const n of [2, 3]) {
      await page.getByRole("button", { name: "Older programs →" }).and(page.locator(":enabled")).click();
      await page.getByText(`Page ${n}`).waitFor();
      await page
        .getByTestId("program-row")
        .filter({ hasText: references[100 - 50 * (n - 1)] })
        .waitFor(); // the page's newest row
    }
    await page.getByTestId("program-row").filter({ hasText: references[0] }).waitFor(); // the oldest, the 101st from the top
    expect(await page.getByTestId("program-row").count()).toBe(1);
    await page.getByRole("button", { name: "Newest" }).click();
    await page.getByTestId("program-row").filter({ hasText: references[100] }).waitFor();
    // Searching finds one by part of its reference.
    await page.goto(`${BASE_URL}/console/programs?search=page-007`);
    await page.getByTestId("program-row").filter({ hasText: "PAGE-007" }).waitFor();
    expect(await page.getByTestId("program-row").count()).toBe(1);
    await page.context().close();
  }, 120_000);
});

describe("uploads", () => {
  it("take the shear's name in the CSV, and offer a template to start from", async () => {
    const page = await signIn(shop.admins[0]);
    await page.goto(`${BASE_URL}/console/upload`);
    const template = await page.request.get(`${BASE_URL}/console/upload/template`);
    expect(template.headers()["content-type"]).toMatch(/text\/csv/);
    expect(await template.text()).toMatch(/^reference,title,shear,.*\nSO-2291\/4,Side panels,Test shear,/);
    const csv = [
      "reference,title,shear,grade,thickness,gauge,units,sheet_length,sheet_width,sheet_count,backgauge,count,length,turn,scrap,note,priority,due_at",
      "BY-NAME-1,By name,test SHEAR,A36,,10,in,120,48,2,12,3,,,,,,",
      "BY-NAME-1,,,,,,,,,,16,7,12,yes,,,,",
    ].join("\n");
    await page.setInputFiles("input[type=file]", {
      name: "by-name.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(csv),
    });
    await page.getByRole("button", { name: "Check and import" }).click();
    await page.getByTestId("upload-created").waitFor();
    expect(await page.getByTestId("upload-created").textContent()).toMatch(/1 draft program created/);
    await page.context().close();
  });
});

describe("webhook deliveries", () => {
  it("open each attempt to the headers and body sent and the answer received", async () => {
    const auth = { Authorization: `Bearer ${shop.key}` };
    const endpoint = (
      await request(BASE_URL)
        .post("/api/v1/webhook-endpoints")
        .set(auth)
        .send({ url: receiver.url, description: "Inspection receiver" })
        .expect(201)
    ).body.endpoint;
    receiver.respond = () => ({ status: 202, headers: { "X-Receiver": "inspected" }, body: "thanks" });
    await request(BASE_URL).post(`/api/v1/webhook-endpoints/${endpoint.id}/test`).set(auth).expect(202);
    await receiver.waitFor(1);
    const page = await signIn(shop.admins[0]);
    for (let i = 0; i < 30; i++) {
      await page.goto(`${BASE_URL}/console/webhooks/${endpoint.id}`);
      if (await page.getByTestId("attempt").count()) break;
      await page.waitForTimeout(200);
    }
    const attempt = page.getByTestId("attempt").first();
    await attempt.locator("summary").click();
    const text = (await attempt.textContent())!;
    expect(text).toContain("webhook-signature: v1,");
    expect(text).toContain(`webhook-id: ${receiver.received[0].headers["webhook-id"]}`);
    expect(text).toContain('"type": "endpoint.test"');
    expect(text).toContain("HTTP 202");
    expect(text).toContain("x-receiver: inspected");
    expect(text).toContain("thanks");
    await page.context().close();
  });
});

describe("a developer", () => {
  it("creates a read-only key of their own, and nothing more", async () => {
    const em = (await testOrm()).em.fork();
    const viewer = await em.findOneOrFail(User, { email: shop.viewer });
    const membership = await em.findOneOrFail(Membership, { user: viewer, shop: shop.shopId });
    membership.role = "developer";
    await em.flush();
    const page = await signIn(shop.viewer);
    await page.goto(`${BASE_URL}/console/keys`);
    expect(await page.locator('input[name=scopes][value="programs:write"]').count()).toBe(0);
    await page.getByLabel("Name").fill("My reads");
    await page.getByRole("button", { name: "Read-only" }).click();
    await page.getByRole("button", { name: "Create key" }).click();
    const secret = (await page.getByTestId("secret").textContent())!;
    await request(BASE_URL).get("/api/v1/programs").set("Authorization", `Bearer ${secret}`).expect(200);
    await request(BASE_URL)
      .post("/api/v1/programs")
      .set("Authorization", `Bearer ${secret}`)
      .send(exampleProgram(shop.shearId))
      .expect(403);
    await page.context().close();
  });
});
