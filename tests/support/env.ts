/** Where the test suite's own services and server live (see scripts/lib/services.ts testProfile). */
import { LOOPBACK_ONLY } from "../../lib/network";
import { appEnv } from "../../scripts/lib/env";
import { databaseUrl, redisUrl, testProfile } from "../../scripts/lib/services";

export const profile = testProfile();
export const TEST_PORT = Number(process.env.SHEARWIRE_TEST_PORT ?? 3100);
export const BASE_URL = `http://127.0.0.1:${TEST_PORT}`;
export const DATABASE_URL = databaseUrl(profile.pg);
export const REDIS_URL = redisUrl(profile.redis);
export const TEST_DIST_DIR = ".next-test";
export const WORKER_DAEMON = "worker-test";
export const INBOX_URL = `http://127.0.0.1:${profile.mail.httpPort}/messages`;

/** The environment of the test server and worker: webhook schedule ×0.001, disable after 3 failures. */
export function testAppEnv(databaseUrlOverride = DATABASE_URL): NodeJS.ProcessEnv {
  return {
    ...appEnv(profile, TEST_PORT),
    SHEARWIRE_DIST_DIR: TEST_DIST_DIR,
    DATABASE_URL: databaseUrlOverride,
    SHEARWIRE_WEBHOOK_TIME_SCALE: "0.001",
    SHEARWIRE_WEBHOOK_DISABLE_AFTER: "3",
    SHEARWIRE_PRIVATE_RECEIVERS: LOOPBACK_ONLY,
    // A plan job's lock: short, so a test that kills a worker mid-plan sees another take it over within seconds.
    SHEARWIRE_PLAN_LOCK_MS: "3000",
    SHEARWIRE_QUIET: "1",
  };
}
