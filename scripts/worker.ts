/** `npm run worker`: the webhook and sweeper process (started by `npm run up`). */
import { onStopSignal } from "../lib/shutdown";
import { runWorker } from "../lib/worker/worker";

const stop = await runWorker();
onStopSignal(async (sig) => {
  console.log(`[worker] ${sig}: finishing the attempts in flight`);
  await stop();
  process.exit(0);
});
