/**
 * Create an API key from the shell (until the console does it):
 *   npm run key:create -- --shop ridgeback --scopes programs:read,programs:write [--name "ERP"] [--expires 2027-06-30] [--shears shr_…]
 * --shop takes the shop's id or slug; --scopes takes a comma list or "all". The secret is printed once.
 */
import { parseArgs } from "node:util";
import { MikroORM } from "@mikro-orm/postgresql";
import { Shop } from "../entities";
import { SCOPES, type Scope } from "../lib/schemas/enums";
import { ormConfig } from "../lib/db/config";
import { createKey } from "../lib/services/keys";

const { values } = parseArgs({
  options: {
    shop: { type: "string" },
    scopes: { type: "string" },
    name: { type: "string" },
    expires: { type: "string" },
    shears: { type: "string" },
  },
});

function fail(message: string): never {
  console.error(`key:create: ${message}`);
  process.exit(2);
}

if (!values.shop || !values.scopes)
  fail(
    "usage: npm run key:create -- --shop <id|slug> --scopes <scope,…|all> [--name N] [--expires DATE] [--shears shr_…,…]",
  );
const scopes = (values.scopes === "all" ? [...SCOPES] : values.scopes.split(",").map((s) => s.trim())) as Scope[];
const unknown = scopes.filter((s) => !SCOPES.includes(s));
if (unknown.length) fail(`unknown scope(s) ${unknown.join(", ")}; choose from ${SCOPES.join(", ")}`);
const expiresAt = values.expires ? new Date(values.expires) : null;
if (expiresAt && Number.isNaN(expiresAt.getTime())) fail(`--expires ${values.expires} is not a date`);

const orm = await MikroORM.init(ormConfig());
try {
  const em = orm.em.fork();
  const shop = await em.findOne(Shop, { $or: [{ id: values.shop }, { slug: values.shop }] });
  if (!shop) fail(`no shop with id or slug "${values.shop}"`);
  const { key, secret } = await createKey(em, shop.id, {
    name: values.name ?? "Created from the shell",
    scopes,
    shearIds: values.shears ? values.shears.split(",").map((s) => s.trim()) : [],
    expiresAt,
  });
  console.log(`created ${key.id} (${key.prefix}…) for ${shop.name} with ${key.scopes.join(", ")}`);
  console.log(`secret (shown once): ${secret}`);
} finally {
  await orm.close(true);
}
