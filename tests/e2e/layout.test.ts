/**
 * Every console page at a desktop, a tablet and a phone width: nothing scrolls sideways, the
 * navigation works (a menu below desktop widths), a screenshot of each is written for review,
 * and axe-core finds no serious or critical accessibility violation.
 */
import path from "node:path";
import { AxeBuilder } from "@axe-core/playwright";
import type { Browser, BrowserContext, Page } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, SCREENSHOTS } from "../support/browser";
import { BASE_URL } from "../support/env";
import {
  closeTestOrm,
  createTestShop,
  examplePlan,
  exampleProgram,
  TEST_PASSWORD,
  type TestShop,
} from "../support/fixtures";

let browser: Browser;
let shop: TestShop;
const pages: Record<string, string> = {};

const WIDTHS = [
  { name: "desktop", width: 1440, height: 900 },
  { name: "tablet", width: 820, height: 1180 },
  { name: "phone", width: 390, height: 844 },
] as const;

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("layout");
  const auth = { Authorization: `Bearer ${shop.key}` };
  const api = () => request(BASE_URL);
  const program = (await api().post("/api/v1/programs").set(auth).send(exampleProgram(shop.shearId)).expect(201)).body;
  const plan = (
    await api().post("/api/v1/plans").set(auth).set("Prefer", "wait=10").send(examplePlan(shop.shearId)).expect(201)
  ).body;
  await api()
    .post("/api/v1/webhook-endpoints")
    .set(auth)
    .send({ url: "http://localhost:9/hook", description: "ERP receiver" })
    .expect(201);
  // a program created after the endpoint: its event has a delivery (to a port where nothing listens), and Resend
  const delivered = (
    await api()
      .post("/api/v1/programs")
      .set(auth)
      .send(exampleProgram(shop.shearId, `LAYOUT-${Date.now()}`))
      .expect(201)
  ).body;
  const event = (await api().get(`/api/v1/events?subject=${delivered.id}`).set(auth)).body.data[0];
  const grade = (await api().get("/api/v1/grades?limit=1").set(auth)).body.data[0];
  await api()
    .post("/api/v1/stock")
    .set(auth)
    .send({
      kind: "remnant",
      grade: "A36",
      thicknessMm: 3.42,
      lengthMm: 1800,
      widthMm: 600,
      quantity: 2,
      location: "Rack B2",
    })
    .expect(201);
  const log = (await api().get("/api/v1/shears").set(auth)).headers["x-request-id"];
  await new Promise((r) => setTimeout(r, 800)); // the request log is written in batches
  Object.assign(pages, {
    overview: "/console",
    programs: "/console/programs",
    program: `/console/programs/${program.id}`,
    plans: "/console/plans",
    "plan-new": "/console/plans/new",
    plan: `/console/plans/${plan.id}`,
    stock: "/console/stock",
    upload: "/console/upload",
    keys: "/console/keys",
    webhooks: "/console/webhooks",
    events: "/console/events",
    event: `/console/events/${event.id}`,
    logs: "/console/logs",
    log: `/console/logs/${log}`,
    shears: "/console/shears",
    shear: `/console/shears/${shop.shearId}`,
    grades: "/console/grades",
    grade: `/console/grades/${grade.id}`,
    team: "/console/team",
  });
});
afterAll(async () => {
  await browser?.close();
  await closeTestOrm();
});

async function signedIn(width: number, height: number): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width, height } });
  const page = await context.newPage();
  await page.goto(`${BASE_URL}/signin`);
  await page.getByLabel("E-mail").fill(shop.admins[0]);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${BASE_URL}/console`);
  return { context, page };
}

/** How far the page scrolls sideways (0 when it fits the window). */
const sideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

describe.each(WIDTHS)("the console at $name width ($width px)", ({ name, width, height }) => {
  it("never scrolls sideways, and every page is drawn", async () => {
    const { context, page } = await signedIn(width, height);
    const overflowing: string[] = [];
    for (const [label, url] of Object.entries(pages)) {
      await page.goto(`${BASE_URL}${url}`);
      await page.locator("main h1").first().waitFor();
      // the live tables' rows, not their "Loading…": what is measured and drawn is the page as a person sees it
      await page.getByRole("status").filter({ hasText: "Loading" }).first().waitFor({ state: "detached" });
      const extra = await sideways(page);
      if (extra > 1) overflowing.push(`${label} (${extra} px)`);
      await page.screenshot({ path: path.join(SCREENSHOTS, `${name}-${label}.png`), fullPage: true });
    }
    expect(overflowing).toEqual([]);
    await context.close();
  }, 180_000);

  it("keeps what a person acts on in view: an event's Resend, the moments in a list, a program's state", async () => {
    const { context, page } = await signedIn(width, height);
    const inView = async (locator: ReturnType<Page["locator"]>) => {
      await locator.waitFor();
      const box = (await locator.boundingBox())!;
      return box.x >= 0 && box.x + box.width <= width;
    };
    await page.goto(`${BASE_URL}${pages.event}`);
    expect(await inView(page.getByRole("button", { name: "Resend" }).first())).toBe(true);
    await page.goto(`${BASE_URL}${pages.events}`);
    await page.getByTestId("event-row").first().waitFor();
    // the date and the time of a moment break apart rather than widen the table
    const moment = page.getByTestId("event-row").first().locator("time");
    expect(await inView(moment)).toBe(true);
    // a program's state and check beside its reference
    await page.goto(`${BASE_URL}${pages.programs}`);
    await page.getByTestId("program-row").first().waitFor();
    for (const heading of ["State", "Check"])
      expect(await inView(page.getByRole("columnheader", { name: heading }))).toBe(true);
    await context.close();
  });

  it("lets a person move between pages", async () => {
    const { context, page } = await signedIn(width, height);
    if (name !== "desktop") {
      const menu = page.getByRole("button", { name: "Menu" });
      await menu.click();
      await page.getByRole("button", { name: "Close" }).waitFor();
      expect(await page.getByRole("button", { name: "Close" }).getAttribute("aria-expanded")).toBe("true");
      await page.screenshot({ path: path.join(SCREENSHOTS, `${name}-menu-open.png`) });
    }
    await page.getByRole("navigation", { name: "Console" }).getByRole("link", { name: "Webhooks" }).click();
    await page.waitForURL(`${BASE_URL}/console/webhooks`);
    await page.getByRole("heading", { level: 1, name: "Webhooks" }).waitFor();
    if (name !== "desktop") expect(await page.getByRole("navigation", { name: "Console" }).isVisible()).toBe(false); // closed again
    await context.close();
  });
});

describe("accessibility", () => {
  it("axe-core finds no serious or critical violation on any console page", async () => {
    const { context, page } = await signedIn(1440, 900);
    const found: string[] = [];
    for (const [label, url] of Object.entries(pages)) {
      await page.goto(`${BASE_URL}${url}`);
      await page.locator("main h1").first().waitFor();
      const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
      for (const v of result.violations.filter((x) => x.impact === "serious" || x.impact === "critical")) {
        found.push(
          `${label}: ${v.id} (${v.impact}) ${v.nodes
            .slice(0, 3)
            .map((n) => n.target.join(" "))
            .join(" | ")}`,
        );
      }
    }
    expect(found).toEqual([]);
    await context.close();
  }, 180_000);
});
