/**
 * A key's last use is written at most once per resolution window by a process, however many
 * requests with it arrive together: each write waits on the key's row lock while holding a pooled
 * connection. The key itself is still read on every request (a revoked key fails at once:
 * tests/api/security.test.ts).
 */
import { afterAll, describe, expect, it, vi } from "vitest";
import { ApiKey } from "../../entities";
import { authenticate } from "../../lib/services/keys";
import { closeTestOrm, createTestShop, keyFor, testOrm } from "../support/fixtures";

afterAll(closeTestOrm);

describe("recording a key's last use", () => {
  it("writes it once for requests that arrive together, and not again within the window", async () => {
    const shop = await createTestShop("keys-last-use");
    const { key, secret } = await keyFor(shop.shopId, ["catalog:read"]);
    const orm = await testOrm();
    const connection = orm.em.getConnection();
    const execute = vi.spyOn(connection, "execute");
    const writes = () =>
      execute.mock.calls.filter(([sql]) => typeof sql === "string" && sql.startsWith("update api_keys")).length;
    try {
      const together = await Promise.all(
        Array.from({ length: 20 }, () => authenticate(orm.em.fork(), `Bearer ${secret}`)),
      );
      expect(together.every((principal) => principal.keyId === key.id)).toBe(true);
      expect(writes()).toBe(1);
      await authenticate(orm.em.fork(), `Bearer ${secret}`);
      expect(writes()).toBe(1);
    } finally {
      execute.mockRestore();
    }
    await vi.waitFor(async () => {
      const row = await orm.em.fork().findOneOrFail(ApiKey, { id: key.id });
      expect(row.lastUsedAt).toBeInstanceOf(Date);
    });
  });
});
