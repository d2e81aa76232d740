/** `npm run down`: stop what `npm run up` started. Data is kept for the next `npm run up`. */
import { devProfile, stopAll } from "./lib/services";
import { daemon, stopDaemon } from "./lib/web";

const profile = devProfile();
for (const name of ["web", "worker", "mail"]) {
  console.log(`[down] ${name}: ${await stopDaemon(daemon(profile.dataRoot, name))}`);
}
const res = await stopAll(profile);
console.log(`[down] Redis: ${res.redis}; PostgreSQL: ${res.pg}`);
