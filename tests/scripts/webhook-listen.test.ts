import { spawn } from "node:child_process";
import request from "supertest";
import { afterAll, describe, expect, it, vi } from "vitest";
import { BASE_URL } from "../support/env";
import { closeTestOrm, createTestShop } from "../support/fixtures";

afterAll(closeTestOrm);

describe("npm run webhook:listen", () => {
  it("verifies signatures, prints events, and rejects forgeries", async () => {
    const shop = await createTestShop("listen");
    const auth = { Authorization: `Bearer ${shop.key}` };
    const port = 4711;
    const created = await request(BASE_URL)
      .post("/api/v1/webhook-endpoints")
      .set(auth)
      .send({ url: `http://localhost:${port}/` })
      .expect(201);
    const child = spawn(
      "node_modules/.bin/tsx",
      ["scripts/webhook-listen.ts", "--port", String(port), "--secret", created.body.secret],
      { stdio: ["ignore", "pipe", "pipe"] },
    );
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    try {
      await vi.waitFor(() => expect(out).toMatch(/listening/), { timeout: 15_000 });
      await request(BASE_URL).post(`/api/v1/webhook-endpoints/${created.body.endpoint.id}/test`).set(auth).expect(202);
      await vi.waitFor(() => expect(out).toMatch(/endpoint\.test\s+evt_/), { timeout: 15_000 });
      const forged = await fetch(`http://127.0.0.1:${port}/`, {
        method: "POST",
        headers: {
          "webhook-id": "evt_forged",
          "webhook-timestamp": String(Math.floor(Date.now() / 1000)),
          "webhook-signature": "v1,AAAA",
        },
        body: JSON.stringify({ type: "program.completed", timestamp: new Date().toISOString(), data: {} }),
      });
      expect(forged.status).toBe(400);
      await vi.waitFor(() => expect(out).toMatch(/rejected/), { timeout: 5_000 });
    } finally {
      child.kill("SIGTERM");
    }
  }, 60_000);
});
