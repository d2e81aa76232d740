/**
 * Named prepared statements: PostgreSQL keeps one plan per name on each connection, and a
 * statement run in a transaction belongs to it (rolled back with it).
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ormConfig } from "../../lib/db/config";
import { runPrepared } from "../../lib/db/prepared";
import { recreateDatabase } from "../support/db";

let orm: MikroORM;

beforeAll(async () => {
  // one connection, so every statement below meets the same session's prepared statements
  orm = await MikroORM.init({ ...ormConfig(await recreateDatabase("shearwire_prepared")), pool: { min: 1, max: 1 } });
  await orm.em.fork().getConnection().execute("create table tally (n int not null)");
});
afterAll(async () => orm?.close(true));

const count = async () =>
  Number((await orm.em.fork().getConnection().execute<{ n: string }[]>("select count(*) as n from tally"))[0].n);

describe("runPrepared", () => {
  it("answers with the rows, and the session keeps the statement under its name", async () => {
    const em = orm.em.fork();
    expect(await runPrepared<{ n: number }>(em, "test-add", "select ?::int + 1 as n", [1])).toEqual([{ n: 2 }]);
    expect(await runPrepared<{ n: number }>(em, "test-add", "select ?::int + 1 as n", [41])).toEqual([{ n: 42 }]);
    const kept = await em
      .getConnection()
      .execute<{ name: string; statement: string }[]>("select name, statement from pg_prepared_statements");
    expect(kept).toEqual([{ name: "shearwire.test-add", statement: "select $1::int + 1 as n" }]);
  });

  it("runs inside the entity manager's transaction: rolled back with it, committed with it", async () => {
    const insert = "insert into tally (n) values (?)";
    await expect(
      orm.em.fork().transactional(async (tx) => {
        await runPrepared(tx, "test-tally", insert, [1]);
        expect(
          Number(
            (
              await tx
                .getConnection()
                .execute<{ n: string }[]>("select count(*) as n from tally", [], "all", tx.getTransactionContext())
            )[0].n,
          ),
        ).toBe(1);
        throw new Error("roll back");
      }),
    ).rejects.toThrow("roll back");
    expect(await count()).toBe(0);
    await orm.em.fork().transactional((tx) => runPrepared(tx, "test-tally", insert, [2]));
    expect(await count()).toBe(1);
  });
});
