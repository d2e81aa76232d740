/**
 * The console as an attacker would try it, in headless Chromium: a session token after
 * sign-out, an off-site callbackUrl, hostile values in forms, headers that keep the pages
 * out of frames and scripts to our own, sign-in throttling, and forms used before the page's
 * scripts have run.
 */
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash, randomBytes } from "node:crypto";
import { Invitation, SignInAttempt, WebhookEndpoint, ApiKey } from "../../entities";
import { SIGN_IN_LIMITS } from "../../lib/services/sign-in";
import { launch } from "../support/browser";
import { Redis } from "ioredis";
import { BASE_URL, REDIS_URL } from "../support/env";
import { closeTestOrm, createTestShop, TEST_PASSWORD, testOrm, type TestShop } from "../support/fixtures";

let browser: Browser;
let shop: TestShop;

beforeAll(async () => {
  browser = await launch();
  shop = await createTestShop("security");
});
afterAll(async () => {
  await browser?.close();
  await closeTestOrm();
});

async function signIn(page: Page, email: string, callbackUrl?: string) {
  await page.goto(`${BASE_URL}/signin${callbackUrl ? `?callbackUrl=${encodeURIComponent(callbackUrl)}` : ""}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** What a leaked database error looks like in a page: the ORM's statements, PostgreSQL's messages, secrets. */
const SQL =
  /insert into "|update "[a-z_]+" set|select "[a-z]|delete from "|whsec_|violates|syntax error|invalid message format|token_hash/i;

describe("sessions", () => {
  it("refuses a session token once its person signed out", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[1]);
    await page.waitForURL(`${BASE_URL}/console`);
    const cookies = await context.cookies();
    const token = cookies.find((c) => c.name.includes("next-auth.session-token"));
    expect(token).toBeDefined();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/signin/);

    // Replay the old cookie in a fresh browser: the server ended the session, so it is sent to sign in.
    const thief = await browser.newContext();
    await thief.addCookies([token!]);
    const stolen = await thief.newPage();
    const res = await stolen.goto(`${BASE_URL}/console/keys`);
    await stolen.waitForURL(/\/signin/);
    expect(await stolen.content()).not.toContain("API keys</h1>");
    expect(res).not.toBeNull();
    // …and the console's data feeds refuse it too.
    const feed = await thief.request.get(`${BASE_URL}/console/data/programs`, { maxRedirects: 0 });
    expect([302, 303, 307, 308]).toContain(feed.status());
    await context.close();
    await thief.close();
  });
});

describe("after sign-in", () => {
  it.each([
    "https://other.example/",
    "//other.example/x",
    "/\\other.example",
    "javascript:alert(1)",
    "https:other.example",
  ])("stays inside the console when callbackUrl is %s", async (callbackUrl) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[0], callbackUrl);
    await page.waitForURL((url) => url.pathname.startsWith("/console"));
    expect(new URL(page.url()).origin).toBe(BASE_URL);
    await context.close();
  });

  it("follows a callbackUrl on this site", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[0], "/console/webhooks");
    await page.waitForURL(`${BASE_URL}/console/webhooks`);
    await context.close();
  });
});

describe("console forms", () => {
  it("show field errors for over-long and NUL-bearing values, keep what was typed, store nothing and show no SQL", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[0]);
    await page.waitForURL(`${BASE_URL}/console`);
    const em = (await testOrm()).em.fork();
    const keysBefore = await em.count(ApiKey, { shop: shop.shopId });
    const endpointsBefore = await em.count(WebhookEndpoint, { shop: shop.shopId });

    await page.goto(`${BASE_URL}/console/keys`);
    const longName = "k".repeat(300);
    await page.getByLabel("Name").evaluate((el, v) => {
      (el as HTMLInputElement).removeAttribute("maxlength");
      (el as HTMLInputElement).value = v;
    }, longName);
    await page.locator('input[name=scopes][value="programs:read"]').check();
    await page.getByRole("button", { name: "Create key" }).click();
    await page.locator("#key-name-error").waitFor();
    expect(await page.locator("#key-name-error").textContent()).toMatch(/100/);
    expect(await page.getByLabel("Name").inputValue()).toBe(longName);
    expect(await page.content()).not.toMatch(SQL);

    await page.goto(`${BASE_URL}/console/webhooks`);
    await page.getByLabel("URL").fill("https://erp.example/hooks");
    await page.getByLabel("Description").evaluate((el) => {
      (el as HTMLInputElement).value = "before\u0000after";
    });
    await page.getByRole("button", { name: "Add endpoint" }).click();
    await page.getByRole("alert").filter({ hasText: /NUL/ }).first().waitFor();
    expect(await page.getByLabel("URL").inputValue()).toBe("https://erp.example/hooks");
    expect(await page.content()).not.toMatch(SQL);

    for (const url of [
      "javascript:alert(1)",
      "file:///etc/passwd",
      `https://erp.example/${"p".repeat(5000)}`,
      "http://10.1.2.3/hook",
    ]) {
      await page.getByLabel("URL").fill(url);
      await page.getByLabel("Description").fill("d");
      await page.getByRole("button", { name: "Add endpoint" }).click();
      await page.locator("#endpoint-url-error").waitFor();
      expect(await page.getByLabel("URL").inputValue()).toBe(url);
    }
    expect(await em.fork().count(ApiKey, { shop: shop.shopId })).toBe(keysBefore);
    expect(await em.fork().count(WebhookEndpoint, { shop: shop.shopId })).toBe(endpointsBefore);
    await context.close();
  });

  it("refuses to bind a key to another shop's shear", async () => {
    const other = await createTestShop("security-other");
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[0]);
    await page.waitForURL(`${BASE_URL}/console`);
    await page.goto(`${BASE_URL}/console/keys`);
    await page.getByLabel("Name").fill("borrowed shear");
    await page.locator("input[name=scopes][value=gateway]").check();
    // Put the other shop's shear id into the list, as a forged form would.
    await page.locator("select[name=shears]").evaluate((el, id) => {
      const option = document.createElement("option");
      option.value = id;
      option.selected = true;
      el.appendChild(option);
    }, other.shearId);
    await page.getByRole("button", { name: "Create key" }).click();
    await page
      .getByRole("alert")
      .filter({ hasText: /no shear in use with that id/ })
      .first()
      .waitFor();
    expect(await page.locator("[data-testid=secret]").count()).toBe(0);
    await context.close();
  });
});

describe("headers", () => {
  it("keep pages out of frames, scripts to our own, and sniffing off, while the pages and /docs still work", async () => {
    for (const path of ["/", "/signin", "/docs"]) {
      const res = await fetch(`${BASE_URL}${path}`);
      expect(res.status, path).toBe(200);
      const csp = res.headers.get("content-security-policy") ?? "";
      expect(csp, path).toMatch(/frame-ancestors 'none'/);
      expect(csp, path).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
      expect(res.headers.get("x-frame-options")).toBe("DENY");
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    }
    const api = await fetch(`${BASE_URL}/api/v1/health`);
    expect(api.headers.get("x-content-type-options")).toBe("nosniff");

    // No script is refused by the policy on the sign-in page or the reference.
    const page = await browser.newPage();
    const refused: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy/i.test(m.text())) refused.push(m.text());
    });
    await page.goto(`${BASE_URL}/signin`);
    await page.getByLabel("E-mail").waitFor();
    await page.goto(`${BASE_URL}/docs`);
    await page.getByText("Shearwire API", { exact: false }).first().waitFor({ timeout: 20_000 });
    expect(refused).toEqual([]);
    await page.close();
  });
});

describe("sign-in throttling", () => {
  it(
    "slows an account down after repeated wrong passwords, says so, and records each attempt",
    { timeout: 90_000 },
    async () => {
      // Start from a clean count for this machine's address (earlier runs against the same Redis may have added to it).
      const redis = new Redis(REDIS_URL);
      const stale = await redis.keys("shearwire:signin:address:*");
      if (stale.length) await redis.del(...stale);
      await redis.quit();
      const target = await createTestShop("throttle");
      const email = target.admins[0];
      const context = await browser.newContext();
      const page = await context.newPage();
      // The button is disabled until the page's scripts have run (see below): each click waits for it.
      await page.goto(`${BASE_URL}/signin`);
      const wrong = () => testOrm().then((o) => o.em.fork().count(SignInAttempt, { email, outcome: "wrong-password" }));
      for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
        await page.getByLabel("E-mail").fill(email);
        await page.getByLabel("Password").fill(`wrong-${i}`);
        const answered = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
        await page.getByRole("button", { name: "Sign in" }).click();
        await answered;
        // Each wrong password is counted on the server before the next one goes.
        for (let t = 0; t < 100 && (await wrong()) < i + 1; t++) await new Promise((r) => setTimeout(r, 100));
        expect(await wrong(), `wrong passwords recorded after attempt ${i + 1}`).toBe(i + 1);
        await page.getByRole("button", { name: "Sign in" }).and(page.locator(":enabled")).waitFor();
        // after a wrong password the e-mail stays as typed and the password is empty
        expect(await page.getByLabel("E-mail").inputValue()).toBe(email);
        expect(await page.getByLabel("Password").inputValue()).toBe("");
      }
      // Now even the right password is refused, with a clear message.
      await page.getByLabel("E-mail").fill(email);
      await page.getByLabel("Password").fill(TEST_PASSWORD);
      const answered = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
      await page.getByRole("button", { name: "Sign in" }).click();
      expect((await answered).status()).toBe(401);
      await page
        .getByRole("alert")
        .filter({ hasText: /Too many failed sign-ins for this account\. Try again in \d+ minutes?/ })
        .waitFor({ timeout: 10_000 })
        .catch(async (err) => {
          throw new Error(
            `${err.message}; alerts: ${JSON.stringify(await page.getByRole("alert").allTextContents())}, at ${page.url()}`,
          );
        });
      expect(page.url()).toMatch(/\/signin/);
      const attempts = await (await testOrm()).em.fork().find(SignInAttempt, { email });
      expect(attempts.filter((a) => a.outcome === "wrong-password")).toHaveLength(SIGN_IN_LIMITS.perAccount);
      expect(attempts.filter((a) => a.outcome === "throttled")).toHaveLength(1);
      await context.close();
    },
  );
});

describe("before the page's scripts have run", () => {
  /** Holds back the page's scripts (routing also turns the browser's cache off) until `release` is called. */
  async function holdScripts(page: Page): Promise<{ release: () => void; requests: string[] }> {
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    const requests: string[] = [];
    // what a form's submission would send: a navigation, or anything but a GET
    page.on("request", (request) => {
      if (request.isNavigationRequest() || request.method() !== "GET")
        requests.push(`${request.method()} ${request.url()}`);
    });
    // only scripts: the stylesheets (chunks too) must load, or the inline scripts after them would stop the page's parsing
    await page.route(/\/_next\/static\/chunks\/[^?]*\.js(\?|$)/, async (route) => {
      await held;
      await route.continue();
    });
    return { release, requests };
  }

  /** Enter in a field, then a click: neither may send the form the browser's way (a GET with every field in the address). */
  async function tryToSubmit(page: Page, field: string, button: string, requests: string[]) {
    const address = page.url();
    const before = requests.length;
    await page.getByLabel(field).press("Enter");
    await page.getByRole("button", { name: button }).click({ force: true, timeout: 2_000 });
    await new Promise((resolve) => setTimeout(resolve, 500));
    expect(page.url()).toBe(address);
    expect(requests.slice(before)).toEqual([]);
  }

  it("the sign-in form waits for them: its button is disabled, then works", { timeout: 60_000 }, async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const { release, requests } = await holdScripts(page);
    await page.goto(`${BASE_URL}/signin`, { waitUntil: "domcontentloaded" });
    await page.getByLabel("E-mail").fill(shop.admins[0]);
    await page.getByLabel("Password").fill(TEST_PASSWORD);
    expect(await page.getByRole("button", { name: "Sign in" }).isDisabled()).toBe(true);
    await tryToSubmit(page, "Password", "Sign in", requests);
    expect(page.url()).not.toContain("password");
    release();
    await page.getByRole("button", { name: "Sign in" }).and(page.locator(":enabled")).waitFor();
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE_URL}/console`);
    await context.close();
  });

  it("the invitation's password never goes into the address", { timeout: 60_000 }, async () => {
    const em = (await testOrm()).em.fork();
    const token = randomBytes(24).toString("base64url");
    em.create(Invitation, {
      shop: shop.shopId,
      email: `early-${Date.now()}@test.example`,
      role: "viewer",
      tokenHash: createHash("sha256").update(token).digest("hex"),
      invitedBy: "test",
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    await em.flush();
    const context = await browser.newContext();
    const page = await context.newPage();
    const { release, requests } = await holdScripts(page);
    await page.goto(`${BASE_URL}/invite/${token}`, { waitUntil: "domcontentloaded" });
    await page.getByLabel("Your name").fill("Early Bird");
    await page.getByLabel(/Choose a password/).fill("a-long-enough-password");
    expect(await page.getByRole("button", { name: "Join and sign in" }).isDisabled()).toBe(true);
    await tryToSubmit(page, "Your name", "Join and sign in", requests);
    expect(page.url()).not.toContain("password");
    release();
    await page.getByRole("button", { name: "Join and sign in" }).and(page.locator(":enabled")).waitFor();
    await context.close();
  });

  it("a console form's button is disabled until they have, and enabled after", { timeout: 60_000 }, async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, shop.admins[0]);
    await page.waitForURL(`${BASE_URL}/console`);
    const { release, requests } = await holdScripts(page);
    await page.goto(`${BASE_URL}/console/stock`, { waitUntil: "domcontentloaded" });
    await page.getByLabel("Location").fill("Rack Z9");
    expect(await page.getByRole("button", { name: "Add stock" }).isDisabled()).toBe(true);
    await tryToSubmit(page, "Location", "Add stock", requests);
    expect(page.url()).not.toContain("Rack");
    release();
    await page.getByRole("button", { name: "Add stock" }).and(page.locator(":enabled")).waitFor();
    await context.close();
  });
});
