/**
 * Vitest global setup: the test suite's own PostgreSQL and Redis (throw-away data, other
 * ports than `npm run up`), a freshly migrated database, and the built app served on
 * 127.0.0.1:3100 so API tests go through real HTTP. `npm test` builds the app first; a
 * direct `npx vitest` builds it only when no test build exists (SHEARWIRE_REBUILD=1 forces it).
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { MikroORM } from "@mikro-orm/postgresql";
import { ormConfig } from "../../lib/db/config";
import { migrateUp } from "../../lib/db/migrate";
import { startAll, stopAll } from "../../scripts/lib/services";
import { buildApp, daemon, startMail, startWeb, startWorker, stopDaemon, waitForHttp } from "../../scripts/lib/web";
import { recreateDatabase } from "../support/db";
import { BASE_URL, profile, TEST_DIST_DIR, TEST_PORT, testAppEnv, WORKER_DAEMON } from "../support/env";

export default async function setup() {
  process.env.SHEARWIRE_QUIET ??= "1";
  const started = await startAll(profile);
  const url = await recreateDatabase(profile.pg.database);
  const orm = await MikroORM.init(ormConfig(url));
  try {
    await migrateUp(orm);
  } finally {
    await orm.close(true);
  }

  const env = testAppEnv(url);
  if (process.env.SHEARWIRE_REBUILD === "1" || !existsSync(path.join(TEST_DIST_DIR, "BUILD_ID"))) buildApp(env);
  const web = daemon(profile.dataRoot, "web-test");
  const worker = daemon(profile.dataRoot, WORKER_DAEMON);
  const mail = daemon(profile.dataRoot, "mail-test");
  for (const d of [web, worker, mail]) await stopDaemon(d);
  await startMail(mail, profile.mail, env);
  startWorker(worker, env);
  await startWeb(web, TEST_PORT, env);
  await waitForHttp(`${BASE_URL}/api/v1/health`, web);

  return async () => {
    for (const d of [web, worker, mail]) await stopDaemon(d);
    if (started.pg === "started" && !process.env.SHEARWIRE_KEEP_SERVICES) await stopAll(profile);
  };
}
