import type { MikroORM } from "@mikro-orm/postgresql";

/** Apply every pending migration; returns the names applied. */
export async function migrateUp(orm: MikroORM): Promise<string[]> {
  const applied = await orm.getMigrator().up();
  return applied.map((m) => m.name);
}

/** True when the entities differ from what the migrations build (a migration is missing). */
export async function migrationNeeded(orm: MikroORM): Promise<boolean> {
  return orm.getMigrator().checkMigrationNeeded();
}
