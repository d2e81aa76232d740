/**
 * The console in headless Chromium against the built app and real PostgreSQL: sign in, keys
 * (secret once, used, revoked), webhooks (add, test, delivery), programs with their drawing,
 * and roles enforced by the server. Every page is saved as a screenshot for review.
 */
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createProgram } from "../../lib/services/programs";
import { launch, SCREENSHOTS } from "../support/browser";
import { BASE_URL, INBOX_URL } from "../support/env";
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
  shop = await createTestShop("console");
  receiver = await startReceiver();
});
afterAll(async () => {
  await browser?.close();
  await receiver?.close();
  await closeTestOrm();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${BASE_URL}/console`);
  await page.waitForURL(/\/signin/);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${BASE_URL}/console`);
}

const shot = (page: Page, name: string) =>
  page.screenshot({ path: path.join(SCREENSHOTS, `console-${name}.png`), fullPage: true });

describe("the console", () => {
  it("sends a visitor without a session to sign-in, and refuses a wrong password", async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE_URL}/console/keys`);
    await page.waitForURL(/\/signin\?callbackUrl=%2Fconsole%2Fkeys/);
    await shot(page, "signin");
    await page.getByLabel("E-mail").fill(shop.admins[0]);
    await page.getByLabel("Password").fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    // (Next's route announcer is an empty alert too: look for ours by its words)
    await page.getByRole("alert").filter({ hasText: "do not match" }).waitFor();
    await page.close();
  });

  it("creates a key, shows its secret once, and the API honours it until it is revoked", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signIn(page, shop.admins[0]);
    await shot(page, "overview");
    await page.goto(`${BASE_URL}/console/keys`);
    await page.getByLabel("Name").fill("Browser test key");
    await page.getByLabel("catalog:read").check();
    await page.getByRole("button", { name: "Create key" }).click();
    const secret = (await page.getByTestId("secret").textContent())!;
    expect(secret).toMatch(/^swk_(?!live_)/);
    await shot(page, "keys-created");

    await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`).expect(200);

    await page.goto(`${BASE_URL}/console/keys`);
    expect(await page.content()).not.toContain(secret); // shown once
    const row = page.getByRole("row", { name: /Browser test key/ });
    page.once("dialog", (d) => d.accept());
    await row.getByRole("button", { name: "Revoke key Browser test key" }).click();
    await row.waitFor({ state: "detached" }); // revoked keys are hidden unless asked for
    await page.getByRole("link", { name: /Show 1 revoked key/ }).click();
    await page
      .getByRole("row", { name: /Browser test key/ })
      .getByText("revoked")
      .waitFor();
    await shot(page, "keys");
    await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${secret}`).expect(401);
    await page.close();
  });

  it("adds a webhook endpoint, sends a test event and shows the delivery", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signIn(page, shop.admins[0]);
    await page.goto(`${BASE_URL}/console/webhooks`);
    await page.getByLabel("URL").fill(receiver.url);
    await page.getByLabel("Description").fill("Browser test receiver");
    await page.getByRole("button", { name: "Add endpoint" }).click();
    expect(await page.getByTestId("webhook-secret").textContent()).toMatch(/^whsec_/);
    await page.reload();
    await page.getByRole("button", { name: "Send test event" }).click();
    await receiver.waitFor(1);
    for (let i = 0; i < 20; i++) {
      await page.reload();
      if (await page.getByTestId("delivery").filter({ hasText: "succeeded" }).count()) break;
      await page.waitForTimeout(250);
    }
    expect(await page.getByTestId("delivery").filter({ hasText: "endpoint.test" }).count()).toBeGreaterThan(0);
    await shot(page, "webhooks");
    await page.goto(`${BASE_URL}/console/events`);
    await page.getByTestId("event-row").filter({ hasText: "endpoint.test" }).first().waitFor();
    await shot(page, "events");
    await page
      .getByTestId("event-row")
      .filter({ hasText: "endpoint.test" })
      .first()
      .getByRole("link", { name: /^evt_/ })
      .click();
    await page.getByText("Deliveries and their attempts").waitFor();
    expect(await page.getByRole("cell", { name: receiver.url }).count()).toBeGreaterThan(0);
    await shot(page, "event");
    await page.close();
  });

  it("shows a program with its findings, setup, safety caution and drawing", async () => {
    const em = (await testOrm()).em.fork();
    const good = await createProgram(em, shop.shopId, exampleProgram(shop.shearId, "CONSOLE-1"));
    const bad = exampleProgram(shop.shearId, "CONSOLE-2");
    bad.cuts[1].backgauge = 130;
    const faulty = await createProgram(em.fork(), shop.shopId, bad);
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, shop.admins[0]);
    await page.goto(`${BASE_URL}/console/programs`);
    await page.getByRole("link", { name: "CONSOLE-1" }).waitFor();
    await shot(page, "programs");
    await page.goto(`${BASE_URL}/console/programs/${good.id}`);
    await page.getByText("Safety first").waitFor();
    expect(await page.locator("svg[role=img] > line").count()).toBe(3 + 4 * 7); // 3 rips, then 7 crosscuts in each of 4 strips
    expect(await page.locator('svg[role=img] > rect[data-kind="blank"]').count()).toBe(28); // the yield beside it: 28 blanks per sheet
    expect(await page.locator('svg[role=img] > rect[data-kind="offcut"]').count()).toBe(4); // one 8 × 12 in offcut per strip
    await page.getByText("Blade gap", { exact: true }).waitFor();
    await page.getByTestId("setup-gapCentre").waitFor(); // the gap at the centre and at the ends, each with its reason
    await page.getByTestId("setup-gapEnds").waitFor();
    await shot(page, "program");
    await page.goto(`${BASE_URL}/console/programs/${faulty.id}`);
    await page.getByText("/cuts/1/backgauge").first().waitFor();
    await shot(page, "program-findings");
    // the request log loads in the browser from the console's own feed
    await request(BASE_URL).get("/api/v1/shears").set("Authorization", `Bearer ${shop.key}`).expect(200);
    await page.goto(`${BASE_URL}/console/logs`);
    await page.getByTestId("request-row").first().waitFor({ timeout: 15_000 });
    await shot(page, "logs");
    await page.getByRole("link", { name: /^req_/ }).first().click();
    await page.getByText("Bodies and secrets are never logged.").waitFor();
    await shot(page, "log-detail");
    await page.close();
  });

  it("keeps the catalog with forms checked by the API's own schemas", async () => {
    const page = await browser.newPage({ viewport: { width: 1600, height: 1000 } });
    await signIn(page, shop.admins[0]);
    await page.goto(`${BASE_URL}/console/shears`);
    const form = page.locator("form", { hasText: "Rated thickness" });
    const fill = async (label: string, value: string) => form.getByLabel(label, { exact: false }).first().fill(value);
    await fill("Name", "Bay 5 light shear");
    for (const [label, value] of [
      ["Rated thickness", "3"],
      ["Rated at tensile", "414"],
      ["Rated at rake", "1"],
      ["Blade length", "2500"],
      ["Backgauge from", "600"],
      ["Backgauge to", "500"],
      ["Rake from", "0.5"],
      ["Rake to", "2"],
      ["Blade gap from", "0.02"],
      ["Blade gap to", "0.5"],
      ["Strokes", "40"],
      ["Backgauge speed", "200"],
      ["Handling per turn", "5"],
      ["Handling per sheet", "20"],
    ] as const)
      await fill(label, value);
    await form.getByRole("button", { name: "Add" }).click();
    await form.getByText("must not exceed backgaugeMaxMm").waitFor(); // the range rule of the shear schema
    await fill("Backgauge from", "5");
    await form.getByRole("button", { name: "Add" }).click();
    await page.getByRole("link", { name: "Bay 5 light shear" }).waitFor();
    await shot(page, "shears");
    await page.goto(`${BASE_URL}/console/grades`);
    await page.getByRole("link", { name: "A36" }).waitFor();
    await shot(page, "grades");
    await page.getByRole("link", { name: "A36" }).click();
    await page.getByRole("button", { name: "Save changes" }).waitFor();
    await shot(page, "grade");
    await page.getByRole("link", { name: "← Grades" }).click();
    await page.goto(`${BASE_URL}/console/shears/${shop.shearId}`);
    await page.getByRole("button", { name: "Save changes" }).waitFor();
    await shot(page, "shear");
    await page.goto(`${BASE_URL}/console/programs/prg_01J00000000000000000000000`);
    await page.getByText("nothing with that id exists in this shop.").waitFor();
    // An address the console has no page for: its own not-found page, inside the console. (Its status is 200: the
    // console streams its pages behind a loading state, so the status is sent before the page knows; the framework
    // marks such pages noindex.)
    await page.goto(`${BASE_URL}/console/request-log/nothing`);
    expect(await page.locator('meta[name="robots"][content*="noindex"]').count()).toBeGreaterThan(0);
    await page.getByText("The console has no page at this address").waitFor();
    await page.getByRole("link", { name: "Back to the overview" }).waitFor();
    await page.getByRole("link", { name: "Request log" }).waitFor(); // the console's navigation is still there
    await shot(page, "not-found");
    // and outside the console and the API, the site's own page
    const outside = await page.goto(`${BASE_URL}/no-such-page`);
    expect(outside?.status()).toBe(404);
    await page.getByRole("heading", { name: "No page at this address" }).waitFor();
    await page.getByRole("link", { name: "API reference" }).waitFor();
    await page.goto(`${BASE_URL}/console`);
    await shot(page, "overview-traffic");
    await page.close();
  });

  it("lets a person in two shops switch between them, each showing its own data", async () => {
    const second = await createTestShop("console-second");
    const { Membership, User } = await import("../../entities");
    const em = (await testOrm()).em.fork();
    const owner = await em.findOneOrFail(User, { email: shop.admins[0] });
    em.create(Membership, { user: owner, shop: second.shopId, role: "viewer" });
    await em.flush();
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signIn(page, shop.admins[0]);
    expect(await page.getByTestId("role").textContent()).toBe("owner");
    await page.getByLabel("Shop").selectOption(second.shopId);
    await page.getByRole("button", { name: "Go" }).click();
    await page.getByTestId("role").filter({ hasText: "viewer" }).waitFor();
    await page.goto(`${BASE_URL}/console/keys`);
    expect(await page.getByRole("button", { name: "Create key" }).count()).toBe(0); // a viewer there
    await shot(page, "switched-shop");
    await page.close();
  });

  it("uploads a CSV cut list: one bad row is shown and nothing is imported; fixed, it imports", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signIn(page, shop.admins[0]);
    const header =
      "reference,title,shear,grade,thickness,gauge,units,sheet_length,sheet_width,sheet_count,backgauge,count,length,turn,scrap,note,priority,due_at";
    const good = (ref: string) => [
      `${ref},Brackets,${shop.shearId},A36,,10,in,120,48,1,12,3,,,,rips,5,`,
      `${ref},,,,,,,,,,16,7,12,yes,,,,`,
    ];
    const bad = [
      header,
      ...good("UP-1"),
      `UP-2,Plates,${shop.shearId},A36,0.25,,in,96,48,1,twelve,2,,,,,,`,
      ...good("UP-3"),
    ].join("\n");
    await page.goto(`${BASE_URL}/console/upload`);
    await page.setInputFiles("input[type=file]", {
      name: "cut-list.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(bad),
    });
    await page.getByRole("button", { name: "Check and import" }).click();
    const errors = page.getByTestId("upload-errors");
    await errors.waitFor();
    expect(await errors.textContent()).toMatch(/row 4 · backgauge: "twelve" is not a number/);
    await shot(page, "upload-errors");
    const { Program } = await import("../../entities");
    const count = () =>
      testOrm().then((o) => o.em.fork().count(Program, { shop: shop.shopId, reference: { $like: "UP-%" } }));
    expect(await count()).toBe(0);

    const fixed = [header, ...good("UP-1"), ...good("UP-3")].join("\n");
    await page.setInputFiles("input[type=file]", {
      name: "cut-list.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(fixed),
    });
    await page.getByRole("button", { name: "Check and import" }).click();
    await page.getByTestId("upload-created").waitFor();
    expect(await count()).toBe(2);
    await shot(page, "upload");
    await page.close();
  });

  it("plans a cut list: a bad row is named and nothing is stored; fixed, each sheet pattern is drawn and its programs are written", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signIn(page, shop.admins[0]);
    const { Plan, Program } = await import("../../entities");
    const plans = () => testOrm().then((o) => o.em.fork().count(Plan, { shop: shop.shopId }));
    const before = await plans();
    await page.goto(`${BASE_URL}/console/plans/new`);
    await page.getByLabel("Reference").fill("E2E-PLAN");
    await page.getByLabel("Thickness", { exact: true }).fill("3");
    await page.getByLabel(/Stock on hand/).fill("2500, 1250, 4\n3000, 1500");
    const bad = "label,length,width,quantity,can_turn\nbase,600,400,10,yes\nside,450,three hundred,12,yes\n";
    await page.setInputFiles("input[type=file]", {
      name: "blanks.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(bad),
    });
    await page.getByRole("button", { name: "Plan", exact: true }).click();
    const errors = page.getByTestId("plan-errors");
    await errors.waitFor();
    expect(await errors.textContent()).toMatch(/row 3 · width: "three hundred" is not a number/);
    expect(await plans()).toBe(before);
    expect(await page.getByLabel("Thickness", { exact: true }).inputValue()).toBe("3"); // what was sent is shown again
    expect(await page.getByLabel(/paste its rows/).inputValue()).toContain("three hundred"); // the file's rows, to fix in place

    const good = "label,length,width,quantity,can_turn\nbase,600,400,10,yes\nside,450,300,12,yes\ntab,250,150,30,no\n";
    await page.setInputFiles("input[type=file]", {
      name: "blanks.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(good),
    });
    await page.getByLabel(/Trim the first edge by/).fill("5");
    await page.getByRole("button", { name: "Plan", exact: true }).click();
    await page.waitForURL(/\/console\/plans\/pln_/);
    await page.getByTestId("pattern-A").waitFor();
    expect(await page.getByTestId("pattern-A").locator("svg rect").count()).toBeGreaterThan(3);
    expect(await page.getByRole("note", { name: "Safety" }).count()).toBe(1); // the safety caution
    await shot(page, "plan");
    await page.getByRole("button", { name: /Write \d+ draft program/ }).click();
    await page.getByTestId("plan-programs").waitFor();
    const planId = page.url().split("/").pop()!;
    const written = await testOrm().then((o) =>
      o.em.fork().find(Program, { shop: shop.shopId, metadata: { plan: planId } }),
    );
    expect(written.length).toBeGreaterThan(0);
    expect(written.every((p) => p.reference.startsWith("E2E-PLAN/") && p.status === "draft")).toBe(true);
    await page.goto(`${BASE_URL}/console/plans`);
    await shot(page, "plans");
    await page.close();
  });

  it("invites someone by e-mail; the link in the mail sets the password and they sign in", async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    await signIn(page, shop.admins[0]);
    await page.goto(`${BASE_URL}/console/team`);
    const email = `new-${Date.now()}@test.example`;
    await page.getByLabel("E-mail").fill(email);
    await page.locator("form", { hasText: "Send invitation" }).getByLabel("Role").selectOption("developer");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${email}`).waitFor();
    await shot(page, "team");
    let link = "";
    for (let i = 0; i < 40 && !link; i++) {
      const inbox = (await (await fetch(INBOX_URL)).json()) as { to: string[]; text: string }[];
      link = inbox.find((m) => m.to.includes(email))?.text.match(/https?:\/\/\S+\/invite\/\S+/)?.[0] ?? "";
      if (!link) await page.waitForTimeout(250);
    }
    expect(link).toContain("/invite/");
    const fresh = await browser.newContext();
    const p2 = await fresh.newPage();
    await p2.goto(link);
    await p2.getByLabel("Your name").waitFor();
    await p2.screenshot({ path: path.join(SCREENSHOTS, "invite.png") });
    await p2.getByLabel("Your name").fill("New Colleague");
    await p2.getByLabel(/Choose a password/).fill("a-long-enough-password");
    await p2.getByRole("button", { name: "Join and sign in" }).click();
    await p2.waitForURL(/\/signin\?joined=/);
    await p2.getByLabel("Password").fill("a-long-enough-password");
    await p2.getByRole("button", { name: "Sign in" }).click();
    await p2.waitForURL(`${BASE_URL}/console`);
    expect(await p2.getByTestId("role").textContent()).toBe("developer");
    // the link works once
    await p2.goto(link);
    await p2.getByText("This invitation cannot be used").waitFor();
    await fresh.close();
    await page.close();
  });

  it("refuses key creation to a viewer on the server, not only in the page", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    // An admin opens the key form…
    await signIn(page, shop.admins[1]);
    await page.goto(`${BASE_URL}/console/keys`);
    await page.getByLabel("Name").fill("Made by a viewer");
    await page.locator('input[name=scopes][value="programs:read"]').check();
    // …then, in the same browser, the session becomes a viewer's.
    const other = await context.newPage();
    await other.goto(`${BASE_URL}/console`);
    await other.getByRole("button", { name: "Sign out" }).click();
    await other.waitForURL(/\/signin/);
    await other.getByLabel("E-mail").fill(shop.viewer);
    await other.getByLabel("Password").fill(TEST_PASSWORD);
    await other.getByRole("button", { name: "Sign in" }).click();
    await other.waitForURL(`${BASE_URL}/console`);
    expect(await other.getByTestId("role").textContent()).toBe("viewer");
    await other.goto(`${BASE_URL}/console/keys`);
    expect(await other.getByRole("button", { name: "Create key" }).count()).toBe(0);
    // A viewer reads a shear's figures, named, with neither form nor archive button.
    await other.goto(`${BASE_URL}/console/shears/${shop.shearId}`);
    await other.getByText("bladeLengthMm").waitFor();
    expect(
      await other
        .getByRole("definition")
        .filter({ hasText: /^3100$/ })
        .count(),
    ).toBe(1);
    expect(await other.getByRole("button", { name: /Save changes|Archive/ }).count()).toBe(0);
    // The stale form is sent with the viewer's session: the server says no and creates nothing.
    await page.getByRole("button", { name: "Create key" }).click();
    await page.getByRole("alert").filter({ hasText: "viewer" }).waitFor();
    const { ApiKey } = await import("../../entities");
    expect(await (await testOrm()).em.fork().count(ApiKey, { name: "Made by a viewer" })).toBe(0);
    await context.close();
  });
});
