/** `npm run worker`: the webhook and sweeper process (started by `npm run up`). */
import { runWorker } from "../lib/worker/worker";

const stop = await runWorker();
for (const sig of ["SIGTERM", "SIGINT"] as const) {
  process.once(sig, async () => {
    console.log(`[worker] ${sig}: finishing the attempts in flight`);
    await stop();
    process.exit(0);
  });
}
