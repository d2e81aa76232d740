import { chromium } from "playwright-core";
const [, , path, name] = process.argv;
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox"] });
for (const [label, width] of [["desk", 1440], ["tab", 820], ["phone", 390]]) {
  const page = await browser.newPage({ viewport: { width, height: 900 } });
  await page.goto("http://127.0.0.1:3000/console");
  if (page.url().includes("signin")) {
    await page.waitForTimeout(1500);
    await page.fill('input[type="email"]', "ines.varga@ridgeback.example");
    await page.fill('input[type="password"]', "ridgeback-demo-2026");
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/console/, { timeout: 20000 });
  }
  await page.goto(`http://127.0.0.1:3000${path}`);
  await page.waitForTimeout(2000);
  await page.screenshot({ path: `/tmp/shots/${name}-${label}.png`, fullPage: label !== "desk" ? false : true });
  await page.close();
}
await browser.close();
