/** Where the test suite's own services and server live (see scripts/lib/services.ts testProfile). */
import { databaseUrl, redisUrl, testProfile } from "../../scripts/lib/services";

export const profile = testProfile();
export const TEST_PORT = Number(process.env.SHEARWIRE_TEST_PORT ?? 3100);
export const BASE_URL = `http://127.0.0.1:${TEST_PORT}`;
export const DATABASE_URL = databaseUrl(profile.pg);
export const REDIS_URL = redisUrl(profile.redis);
export const TEST_DIST_DIR = ".next-test";
