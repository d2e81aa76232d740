/**
 * The API reference at /docs, in a real browser: it renders our operations, and every
 * request it makes goes to this server (no CDN, no web fonts, no telemetry).
 */
import path from "node:path";
import type { Browser } from "playwright-core";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BASE_URL } from "../support/env";
import { launch, SCREENSHOTS } from "../support/browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("/docs", () => {
  it("loads its script from this server, with no fonts or assistant", async () => {
    const res = await request(BASE_URL).get("/docs").expect(200);
    expect(res.text).toContain('src="/vendor/scalar/standalone.js"');
    expect(res.text).toContain('"url": "/api/v1/openapi.json"');
    expect(res.text).not.toMatch(/https?:\/\/(?!127\.0\.0\.1)[a-z0-9.-]+\.[a-z]{2,}\/[^"]*\.(js|css|woff2?)/i);
    const script = await request(BASE_URL).get("/vendor/scalar/standalone.js").expect(200);
    expect(script.headers["content-type"]).toMatch(/javascript/);
  });

  it("renders the operations in a browser without reaching outside this machine", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const outside: string[] = [];
    page.on("request", (r) => {
      const url = r.url();
      if (!url.startsWith(BASE_URL) && !url.startsWith("data:") && !url.startsWith("blob:")) outside.push(url);
    });
    await page.goto(`${BASE_URL}/docs`, { waitUntil: "networkidle" });
    await page.getByText("Create a cut program").first().waitFor({ timeout: 30_000 });
    await page.getByRole("heading", { name: "Shearwire API" }).first().waitFor({ timeout: 30_000 });
    await page.getByText("Safety.").first().waitFor({ timeout: 30_000 });
    await page.screenshot({ path: path.join(SCREENSHOTS, "docs.png") });
    expect(outside).toEqual([]);
    await page.close();
  });
});
