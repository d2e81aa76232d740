/**
 * `npm run up`: start PostgreSQL and Redis, migrate, seed the demo shop, build, and serve
 * Shearwire on http://127.0.0.1:3000 in the background. Safe to run again: running
 * services are reused and the web server is replaced by a fresh build.
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { ormConfig } from "../lib/db/config";
import { migrateUp } from "../lib/db/migrate";
import { appEnv } from "./lib/env";
import { demoKey } from "./lib/demo-key";
import { closePlanQueue } from "../lib/queue/plan-queue";
import { seedDemo } from "./lib/seed";
import { devProfile, startAll, ServiceError } from "./lib/services";
import path from "node:path";
import { buildApp, daemon, startMail, startWeb, startWorker, stopDaemon, waitForHttp } from "./lib/web";

const port = Number(process.env.PORT ?? 3000);

async function main() {
  const profile = devProfile();
  const services = await startAll(profile);
  console.log(
    `[up] PostgreSQL ${services.pg} on :${profile.pg.port}, Redis ${services.redis} on :${profile.redis.port}`,
  );
  const env = appEnv(profile, port);

  const orm = await MikroORM.init(ormConfig(env.DATABASE_URL));
  let demo;
  let apiKey;
  try {
    const applied = await migrateUp(orm);
    console.log(`[up] migrations: ${applied.length ? applied.join(", ") : "up to date"}`);
    demo = await seedDemo(orm.em.fork());
    apiKey = await demoKey(orm.em.fork(), profile.dataRoot, demo.shop.id);
  } finally {
    await orm.close(true);
    await closePlanQueue();
  }

  const web = daemon(profile.dataRoot, "web");
  const worker = daemon(profile.dataRoot, "worker");
  const mail = daemon(profile.dataRoot, "mail");
  for (const running of [web, worker, mail]) {
    if ((await stopDaemon(running)) === "stopped") console.log(`[up] stopped the previous ${running.name} process`);
  }
  if (process.env.SHEARWIRE_SKIP_BUILD !== "1") {
    console.log("[up] building the app (next build)");
    buildApp(env);
  }
  await startMail(mail, profile.mail, env);
  // supervised: a web server or worker that dies (killed, crashed) is started again
  startWorker(worker, env, { supervised: true });
  await startWeb(web, port, env, { supervised: true });
  await waitForHttp(`${env.SHEARWIRE_BASE_URL}/api/v1/health`, web);

  const base = env.SHEARWIRE_BASE_URL;
  console.log(`
Shearwire is running at ${base}

  Console        ${base}/console
  API reference  ${base}/docs
  Health         ${base}/api/v1/health
  Mail inbox     http://127.0.0.1:${profile.mail.httpPort}/   (every e-mail the product sends lands here)

  Demo shop      ${demo.shop.name}
  Sign in as     ${demo.owner.email}
  Password       ${demo.owner.password}
  Demo API key   ${apiKey}   (every scope)
  Shears         ${demo.shears.map((s) => `${s.id} ${s.name}`).join("\n                 ")}
  Demo plan      ${base}/console/plans/${demo.plan.id}   (${demo.plan.reference}: a week's order laid out on the sheets in stock)

  Try it:  curl -H "Authorization: Bearer ${apiKey}" ${base}/api/v1/shears

  Logs           ${path.dirname(web.logFile)}/{web,worker,mail}.log
  Gateway sim    npm run gateway:sim -- --shear ${demo.shears[0].id} --key ${apiKey}
  Webhooks       npm run webhook:listen -- --port 4000 --secret <whsec_… of an endpoint you add for http://127.0.0.1:4000/>
  Stop with      npm run down

Safety: settings Shearwire computes are recommendations for a qualified operator. The
machine's manual, local codes and your qualified people come first.
`);
}

main().catch((err) => {
  console.error(err instanceof ServiceError ? `[up] ${err.message}` : err);
  process.exit(1);
});
