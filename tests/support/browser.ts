/** Headless Debian Chromium driven by playwright-core, on this machine's loopback only. */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser } from "playwright-core";

export const SCREENSHOTS = path.join("tests", "artifacts", "screenshots");

export async function launch(): Promise<Browser> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--disable-dev-shm-usage",
    ],
  });
}
