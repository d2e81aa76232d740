/**
 * The demo API key `npm run up` prints: created once with every scope, its secret kept in the
 * (uncommitted) data folder so the next `npm run up` prints the same working key.
 */
import { createHash } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { EntityManager } from "@mikro-orm/postgresql";
import { ApiKey } from "../../entities";
import { SCOPES } from "../../lib/schemas/enums";
import { createKey } from "../../lib/services/keys";

export async function demoKey(em: EntityManager, dataRoot: string, shopId: string): Promise<string> {
  const file = path.join(dataRoot, "demo-api-key.secret");
  if (existsSync(file)) {
    const secret = readFileSync(file, "utf8").trim();
    const hash = createHash("sha256").update(secret).digest("hex");
    const key = await em.findOne(ApiKey, { hash, shop: shopId, revokedAt: null });
    if (key && (!key.expiresAt || key.expiresAt > new Date())) return secret;
  }
  const { secret } = await createKey(em, shopId, { name: "Demo key (all scopes)", scopes: [...SCOPES] });
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
