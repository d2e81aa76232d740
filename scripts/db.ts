/**
 * Database commands: `up` applies migrations, `check` fails when the entities need a
 * migration that is not written yet, `create [name]` writes one, `seed` loads the demo shop.
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { ormConfig } from "../lib/db/config";
import { migrateUp, migrationNeeded } from "../lib/db/migrate";
import { closePlanQueue } from "../lib/queue/plan-queue";
import { seedDemo } from "./lib/seed";

const [command, name] = process.argv.slice(2);
const orm = await MikroORM.init(ormConfig());
let code = 0;
try {
  if (command === "up") {
    const applied = await migrateUp(orm);
    console.log(applied.length ? `applied: ${applied.join(", ")}` : "database is up to date");
  } else if (command === "check") {
    if (await migrationNeeded(orm)) {
      console.error("the entities have changes that no migration covers: run npm run migration:create");
      code = 1;
    } else console.log("migrations match the entities");
  } else if (command === "create") {
    const result = await orm.getMigrator().createMigration("./migrations", false, false, name);
    if (!result.fileName) console.log("no changes: no migration written");
    else console.log(`wrote migrations/${result.fileName}: add it to migrations/index.ts`);
  } else if (command === "seed") {
    await migrateUp(orm);
    const demo = await seedDemo(orm.em.fork());
    console.log(JSON.stringify(demo, null, 2));
  } else {
    console.error("usage: tsx scripts/db.ts up|check|create [name]|seed");
    code = 2;
  }
} finally {
  await orm.close(true);
  await closePlanQueue();
}
process.exit(code);
