/** A fresh database with one shop, shear, grade library and an unthrottled key, for the benchmarks. */
import { MikroORM } from "@mikro-orm/postgresql";
import pg from "pg";
import { Shear, Shop } from "../../entities";
import { SCOPES } from "../../lib/schemas/enums";
import { ormConfig } from "../../lib/db/config";
import { migrateUp } from "../../lib/db/migrate";
import { createKey } from "../../lib/services/keys";
import { addGradeLibrary } from "./seed";
import { databaseUrl, startAll, testProfile } from "./services";

export async function benchDatabase(name: string) {
  const profile = testProfile();
  process.env.SHEARWIRE_QUIET = "1";
  await startAll(profile);
  const admin = new pg.Client({ connectionString: databaseUrl({ ...profile.pg, database: "postgres" }) });
  await admin.connect();
  await admin.query(`drop database if exists "${name}" with (force)`);
  await admin.query(`create database "${name}"`);
  await admin.end();
  const url = databaseUrl({ ...profile.pg, database: name });

  const orm = await MikroORM.init(ormConfig(url));
  await migrateUp(orm);
  const em = orm.em.fork();
  const shop = em.create(Shop, { name: "Bench shop", slug: "bench" });
  const shear = em.create(Shear, {
    shop,
    name: "Bench shear",
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
  });
  addGradeLibrary(em, shop);
  await em.flush();
  const { secret } = await createKey(em, shop.id, { name: "bench", scopes: [...SCOPES], rateLimitPerMin: 10_000_000 });
  return { profile, url, orm, shopId: shop.id, shearId: shear.id, key: secret };
}
