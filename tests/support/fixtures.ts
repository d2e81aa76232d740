/** Test fixtures written straight to the test database: shops, catalog, keys. */
import { MikroORM } from "@mikro-orm/postgresql";
import bcrypt from "bcryptjs";
import { Membership, Shear, Shop, User } from "../../entities";
import { SCOPES, type Scope } from "../../lib/schemas/enums";
import { ormConfig } from "../../lib/db/config";
import { createKey } from "../../lib/services/keys";
import { addGradeLibrary } from "../../scripts/lib/seed";
import { EXAMPLE_PROGRAM } from "../../lib/schemas/program";
import { EXAMPLE_PLAN } from "../../lib/schemas/plan";
import { DATABASE_URL } from "./env";

let orm: MikroORM | undefined;

export async function testOrm(): Promise<MikroORM> {
  orm ??= await MikroORM.init(ormConfig(DATABASE_URL));
  return orm;
}

export async function closeTestOrm() {
  await orm?.close(true);
  orm = undefined;
}

let counter = 0;

/** Every test person signs in with this password (bcrypt, low cost to keep tests quick). */
export const TEST_PASSWORD = "test-password-1";
const TEST_PASSWORD_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

/** A machine profile for tests (invented figures): a 3 m shear rated 6.35 mm at 414 MPa and 1.5°. */
export const TEST_SHEAR = {
  ratedThicknessMm: 6.35,
  ratedTensileMpa: 414,
  ratedRakeDeg: 1.5,
  bladeLengthMm: 3100,
  backgaugeMinMm: 5,
  backgaugeMaxMm: 1000,
  rakeMinDeg: 0.5,
  rakeMaxDeg: 2.5,
  gapMinMm: 0.03,
  gapMaxMm: 1,
  strokesPerMin: 30,
  backgaugeSpeedMmPerS: 250,
  handlingSecondsPerTurn: 6,
  handlingSecondsPerSheet: 30,
  maxBladeHardnessHb: 300,
  gradeThicknessLimitsMm: {},
};

export interface TestShop {
  shopId: string;
  shearId: string;
  /** a key with every scope */
  key: string;
  /** the e-mail addresses of its owner and admin */
  admins: string[];
  /** the e-mail address of its viewer */
  viewer: string;
}

/** A new shop with one shear, the grade library and an all-scopes key. */
export async function createTestShop(label = "shop"): Promise<TestShop> {
  const em = (await testOrm()).em.fork();
  const slug = `${label}-${process.pid}-${Date.now()}-${counter++}`;
  const shop = em.create(Shop, { name: `Test ${slug}`, slug });
  const shear = em.create(Shear, { ...TEST_SHEAR, name: "Test shear", shop });
  addGradeLibrary(em, shop);
  const admins = [`owner-${slug}@test.example`, `admin-${slug}@test.example`];
  for (const [i, email] of [...admins, `viewer-${slug}@test.example`].entries()) {
    const user = em.create(User, { email, name: `Test person ${i}`, passwordHash: TEST_PASSWORD_HASH });
    em.create(Membership, { user, shop, role: (["owner", "admin", "viewer"] as const)[i] });
  }
  await em.flush();
  const { secret } = await createKey(em, shop.id, { name: "all scopes", scopes: [...SCOPES] });
  return { shopId: shop.id, shearId: shear.id, key: secret, admins, viewer: `viewer-${slug}@test.example` };
}

export async function keyFor(
  shopId: string,
  scopes: Scope[],
  extra: { expiresAt?: Date; rateLimitPerMin?: number } = {},
) {
  const em = (await testOrm()).em.fork();
  return createKey(em, shopId, { name: `test ${scopes.join(",")}`, scopes, ...extra });
}

/** The cut-program worked example of our API docs, on a given shear. */
export function exampleProgram(shearId: string, reference = `SO-${Date.now()}-${counter++}`) {
  return { ...structuredClone(EXAMPLE_PROGRAM), shear: shearId, reference };
}

/** The plan example of our API docs (an invented order), on a given shear. */
export function examplePlan(shearId: string, reference = `PL-${Date.now()}-${counter++}`) {
  return { ...structuredClone(EXAMPLE_PLAN), shear: shearId, reference };
}
