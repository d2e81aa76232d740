import { MikroORM } from "@mikro-orm/postgresql";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ormConfig } from "../../lib/db/config";
import { migrateUp, migrationNeeded } from "../../lib/db/migrate";
import { migrationsList } from "../../migrations";
import { recreateDatabase } from "../support/db";

let orm: MikroORM;

beforeAll(async () => {
  orm = await MikroORM.init(ormConfig(await recreateDatabase("shearwire_migrations")));
});
afterAll(async () => orm?.close(true));

const tables = async () =>
  (
    await orm.em
      .getConnection()
      .execute<{ table_name: string }[]>(
        "select table_name from information_schema.tables where table_schema = 'public' order by table_name",
      )
  ).map((r) => r.table_name);

describe("migrations", () => {
  it("run up from an empty database, in the order listed in code", async () => {
    expect(await tables()).toEqual([]);
    const applied = await migrateUp(orm);
    expect(applied).toEqual(migrationsList.map((m) => m.name));
    expect(await tables()).toEqual(expect.arrayContaining(["grades", "memberships", "shears", "shops", "users"]));
  });

  it("leave nothing for a new migration to do (migration:check is clean)", async () => {
    expect(await migrationNeeded(orm)).toBe(false);
  });

  it("are not applied twice", async () => {
    expect(await migrateUp(orm)).toEqual([]);
  });

  it("roll all the way down and up again", async () => {
    await orm.getMigrator().down({ to: 0 });
    expect(await tables()).toEqual(["mikro_orm_migrations"]);
    await migrateUp(orm);
    expect(await migrationNeeded(orm)).toBe(false);
  });
});
