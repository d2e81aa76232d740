import request from "supertest";
import { describe, expect, it } from "vitest";
import { version } from "../../package.json";
import { BASE_URL } from "../support/env";

describe("GET /api/v1/health (real server)", () => {
  it("reports the database and Redis up, and the version", async () => {
    const res = await request(BASE_URL).get("/api/v1/health").expect(200);
    expect(res.headers["content-type"]).toMatch(/application\/json/);
    expect(res.headers["cache-control"]).toBe("no-store");
    expect(res.body).toMatchObject({
      status: "ok",
      version,
      database: { status: "up" },
      redis: { status: "up" },
    });
    expect(Date.parse(res.body.time)).not.toBeNaN();
  });
});

describe("landing page (real server)", () => {
  it("says what Shearwire is and links to the console and the API reference", async () => {
    const res = await request(BASE_URL).get("/").expect(200);
    expect(res.text).toContain("Shearwire");
    expect(res.text).toContain('href="/console"');
    expect(res.text).toContain('href="/docs"');
    await request(BASE_URL)
      .get("/console")
      .expect(307)
      .expect("location", /\/signin/);
    for (const href of ["/signin", "/docs", "/api/v1/health", "/logo.svg"]) {
      await request(BASE_URL).get(href).expect(200);
    }
  });
});
