/** `npm run worker`: the webhook and sweeper process (started by `npm run up`). */
import { runWorker } from "../lib/worker/worker";

const stop = await runWorker();
// A second signal changes nothing (tsx, which runs this script, may pass one on again a moment later; with no
// listener left, the process would end at once, mid-attempt).
let stopping = false;
for (const sig of ["SIGTERM", "SIGINT"] as const) {
  process.on(sig, async () => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] ${sig}: finishing the attempts in flight`);
    await stop();
    process.exit(0);
  });
}
