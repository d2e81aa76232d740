/**
 * Named prepared statements: PostgreSQL keeps one plan per name on each connection, and a
 * statement run in a transaction belongs to it (rolled back with it). A raw transaction on a
 * pooled connection commits, rolls back, and leaves the pool a usable connection either way.
 */
import { MikroORM } from "@mikro-orm/postgresql";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ormConfig } from "../../lib/db/config";
import { rawTransaction, runPrepared } from "../../lib/db/prepared";
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
    expect(await runPrepared<{ n: number }>(em, "test-add", "select $1::int + 1 as n", [1])).toEqual([{ n: 2 }]);
    expect(await runPrepared<{ n: number }>(em, "test-add", "select $1::int + 1 as n", [41])).toEqual([{ n: 42 }]);
    const kept = await em
      .getConnection()
      .execute<{ name: string; statement: string }[]>("select name, statement from pg_prepared_statements");
    expect(kept).toEqual([{ name: "shearwire.test-add", statement: "select $1::int + 1 as n" }]);
  });

  it("runs inside the entity manager's transaction: rolled back with it, committed with it", async () => {
    const insert = "insert into tally (n) values ($1)";
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

describe("runPrepared on a knex transaction", () => {
  it("refuses to run on a knex transaction that has already committed (its connection is back in the pool)", async () => {
    const trx = await orm.em.getConnection().getKnex().transaction();
    await trx.commit();
    await expect(runPrepared(trx, "test-add", "select $1::int + 1 as n", [1])).rejects.toThrow(/already ended/);
  });
});

describe("rawTransaction", () => {
  const pid = async () =>
    (await orm.em.fork().getConnection().execute<{ pid: number }[]>("select pg_backend_pid() as pid"))[0].pid;

  it("commits what its statements did, and answers what the work returned", async () => {
    const before = await count();
    const rows = await rawTransaction(orm.em.fork(), async (query) => {
      await query("raw-tally", "insert into tally (n) values ($1)", [7]);
      return query<{ n: number }>("raw-sum", "select sum(n)::int as n from tally where n = $1", [7]);
    });
    expect(rows).toEqual([{ n: 7 }]);
    expect(await count()).toBe(before + 1);
  });

  it("rolls back when the work throws, and the connection serves the next transaction", async () => {
    const before = await count();
    const first = await pid();
    await expect(
      rawTransaction(orm.em.fork(), async (query) => {
        await query("raw-tally", "insert into tally (n) values ($1)", [8]);
        await query("raw-fail", "select 1 / $1::int", [0]);
      }),
    ).rejects.toThrow(/division by zero/);
    expect(await count()).toBe(before);
    // the pool holds one connection: the same session, out of its failed transaction
    expect(await pid()).toBe(first);
    await rawTransaction(orm.em.fork(), (query) => query("raw-tally", "insert into tally (n) values ($1)", [9]));
    expect(await count()).toBe(before + 1);
  });

  it("drops a connection that cannot roll back, and the pool opens another", async () => {
    const first = await pid();
    await expect(
      rawTransaction(orm.em.fork(), (query) => query("raw-end", "select pg_terminate_backend(pg_backend_pid())", [])),
    ).rejects.toThrow();
    const next = await pid();
    expect(next).not.toBe(first);
    const before = await count();
    await rawTransaction(orm.em.fork(), (query) => query("raw-tally", "insert into tally (n) values ($1)", [10]));
    expect(await count()).toBe(before + 1);
  });

  it("marks a connection whose rollback fails so the pool never hands it out again, and releases it", async () => {
    // a connection that begins and runs statements but cannot roll back (as a half-broken socket might)
    const connection: { statements: string[]; __knex__disposed?: unknown; query: (q: unknown) => Promise<unknown> } = {
      statements: [],
      query: async (q) => {
        const text = typeof q === "string" ? q : (q as { text: string }).text;
        connection.statements.push(text);
        if (text === "rollback") throw new Error("connection lost");
        return { rows: [] };
      },
    };
    const released: unknown[] = [];
    const client = {
      acquireConnection: async () => connection,
      releaseConnection: async (c: unknown) => void released.push(c),
    };
    const em = { getConnection: () => ({ getKnex: () => ({ client }) }) } as unknown as Parameters<
      typeof rawTransaction
    >[0];
    await expect(
      rawTransaction(em, async (query) => {
        await query("stub", "select 1", []);
        throw new Error("work failed");
      }),
    ).rejects.toThrow("work failed");
    expect(connection.statements).toEqual(["begin", "select 1", "rollback"]);
    expect(connection.__knex__disposed).toBeInstanceOf(Error);
    expect(released).toEqual([connection]);
  });
});
