/**
 * The build ships everything it needs: fonts are our own files, and no stylesheet or page of
 * the built app points at a font or script host elsewhere.
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { BASE_URL, TEST_DIST_DIR } from "../support/env";

const files = (dir: string, ext: string) =>
  (readdirSync(dir, { recursive: true }) as string[]).filter((f) => f.endsWith(ext)).map((f) => path.join(dir, f));

describe("the built app", () => {
  it("serves its fonts itself", () => {
    const css = files(path.join(TEST_DIST_DIR, "static"), ".css")
      .map((f) => readFileSync(f, "utf8"))
      .join("\n");
    expect(css).toMatch(/@font-face/);
    const fontUrls = [...css.matchAll(/url\(([^)]+\.woff2)\)/g)].map((m) => m[1]);
    expect(fontUrls.length).toBeGreaterThan(0);
    for (const url of fontUrls) expect(url).toMatch(/^(\/_next\/|\.\.?\/)/);
    expect(css).not.toMatch(/fonts\.(googleapis|gstatic)|https?:\/\/[^)"']+\.(woff2?|ttf|otf)/);
  });

  it("pages load nothing from another host", async () => {
    for (const page of ["/", "/signin", "/problems", "/problems/not-found"]) {
      const html = (await request(BASE_URL).get(page).expect(200)).text;
      const external = [...html.matchAll(/(?:src|href)="(https?:\/\/[^"]+)"/g)].map((m) => m[1]);
      expect(external, page).toEqual([]);
    }
  });
});
