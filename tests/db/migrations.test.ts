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

  it("rename stored axes to one pair (a rectangle's length and width, a strip's width) and back", async () => {
    const connection = orm.em.getConnection();
    // A program as answered before the rename (its layout, and metadata that only looks like it) and a plan's result.
    const program = {
      id: "prg_axes",
      metadata: { width: "wide", height: "tall" },
      check: {
        layout: {
          unit: "in",
          rectangles: [{ kind: "blank", group: 1, stroke: 2, x: 0, y: 0, width: 16, height: 12 }],
          cuts: [{ group: 0, stroke: 1, x1: 0, y1: 12, x2: 120, y2: 12, partial: false }],
        },
      },
    };
    const piece = { blank: 0, label: "A", x: 0, y: 0, length: 16, width: 12, turned: false, count: 7 };
    const offcut = { x: 112, y: 0, length: 8, width: 12, kind: "strip-end", reusable: false };
    const plan = { patterns: [{ strips: [{ y: 0, height: 12, repeat: 4, pieces: [piece] }], offcuts: [offcut] }] };
    const bodies = async () =>
      Object.fromEntries(
        (
          await connection.execute<{ idempotency_key: string; response_body: unknown }[]>(
            `select idempotency_key, response_body from idempotency_records where key_id = 'key_axes'`,
          )
        ).map((row) => [row.idempotency_key, row.response_body]),
      );

    await orm.getMigrator().down({ to: "Migration20261203070000_remnant_size" });
    for (const [key, body] of [
      ["program", program],
      ["plan", plan],
    ] as const) {
      await connection.execute(
        `insert into idempotency_records (key_id, idempotency_key, method, path, fingerprint, response_body, created_at, expires_at)
         values ('key_axes', ?, 'POST', '/api/v1/x', 'f', ?::jsonb, now(), now() + interval '1 day')`,
        [key, JSON.stringify(body)],
      );
    }
    await migrateUp(orm);
    expect(await bodies()).toEqual({
      program: {
        ...program,
        check: {
          layout: {
            ...program.check.layout,
            rectangles: [{ kind: "blank", group: 1, stroke: 2, x: 0, y: 0, length: 16, width: 12 }],
          },
        },
      },
      plan: { patterns: [{ strips: [{ y: 0, width: 12, repeat: 4, pieces: [piece] }], offcuts: [offcut] }] },
    });

    await orm.getMigrator().down({ to: "Migration20261203070000_remnant_size" });
    expect(await bodies()).toEqual({ program, plan });
    await migrateUp(orm);
    await connection.execute(`delete from idempotency_records where key_id = 'key_axes'`);
  });

  it("take the layout out of stored checks, keeping every other key in its order", async () => {
    const connection = orm.em.getConnection();
    const layout = {
      unit: "in",
      rectangles: [{ kind: "blank", group: 1, stroke: 2, x: 0, y: 0, length: 16, width: 12 }],
      cuts: [],
    };
    const check = {
      validation: "pass",
      units: "in",
      findings: [],
      yield: { total: { blanks: 56 } },
      layout,
      estimate: null,
    };
    const withoutLayout = {
      validation: "pass",
      units: "in",
      findings: [],
      yield: { total: { blanks: 56 } },
      estimate: null,
    };
    // metadata is strings only: a key named layout there is the client's and stays
    const program = { id: "prg_layout", metadata: { layout: "nested", zeta: "z", alpha: "a" }, check };
    await orm.getMigrator().down({ to: "Migration20261203170000_pending_events" });
    await connection.execute(
      `insert into shops (id, name, slug, created_at, updated_at) values ('shp_layout', 'Layout', 'layout-test', now(), now())`,
    );
    await connection.execute(
      `insert into events (id, shop_id, type, subject_id, data, created_at) values ('evt_layout', 'shp_layout', 'program.created', 'prg_layout', ?::json, now())`,
      [JSON.stringify({ program })],
    );
    await connection.execute(
      `insert into idempotency_records (key_id, idempotency_key, method, path, fingerprint, response_body, created_at, expires_at)
       values ('key_layout', 'batch', 'POST', '/api/v1/programs/batch', 'f', ?::jsonb, now(), now() + interval '1 day')`,
      [
        JSON.stringify({
          programs: [program, { ...program, id: "prg_layout_2", check: { ...check, layout: null } }],
          // not a check (no validation and findings): its layout stays
          other: { layout },
        }),
      ],
    );
    await migrateUp(orm);

    const [event] = await connection.execute<{ data: string }[]>(
      `select data::text from events where id = 'evt_layout'`,
    );
    const data = JSON.parse(event.data);
    expect(data).toEqual({ program: { ...program, check: withoutLayout } });
    // json keeps the order keys were written in: the rewrite keeps it too
    expect(Object.keys(data.program.check)).toEqual(["validation", "units", "findings", "yield", "estimate"]);
    expect(Object.keys(data.program.metadata)).toEqual(["layout", "zeta", "alpha"]);
    const [record] = await connection.execute<{ response_body: { programs: unknown[]; other: unknown } }[]>(
      `select response_body from idempotency_records where key_id = 'key_layout'`,
    );
    expect(record.response_body.programs).toEqual([
      { ...program, check: withoutLayout },
      { ...program, id: "prg_layout_2", check: withoutLayout },
    ]);
    expect(record.response_body.other).toEqual({ layout });
    await connection.execute(`delete from idempotency_records where key_id = 'key_layout'`);
    await connection.execute(`delete from shops where id = 'shp_layout'`);
  });
  it("keep a program's check and an event's body as the text written, in text columns compressed with lz4", async () => {
    const connection = orm.em.getConnection();
    await orm.getMigrator().down({ to: "Migration20261203220000_check_without_layout" });
    await connection.execute(
      `insert into shops (id, name, slug, created_at, updated_at) values ('shp_text', 'Text', 'text-test', now(), now())`,
    );
    // as json stored it: the text as written, spaces and key order included
    const written = '{"program": {"id":"prg_text", "title":"Blank \\u00e9 ü 東", "check":{"z":1,"a":[0.1,2e-7]}}}';
    await connection.execute(
      `insert into events (id, shop_id, type, subject_id, data, created_at) values ('evt_text', 'shp_text', 'program.created', 'prg_text', ?::json, now())`,
      [written],
    );
    await migrateUp(orm);
    const [event] = await connection.execute<{ data: unknown }[]>(`select data from events where id = 'evt_text'`);
    expect(event.data).toBe(written);
    const columns = await connection.execute<{ name: string; type: string; compression: string }[]>(
      `select attrelid::regclass || '.' || attname as name, atttypid::regtype::text as type, attcompression as compression
       from pg_attribute where (attrelid, attname) in (('programs'::regclass, 'check'), ('events'::regclass, 'data'))
       order by 1`,
    );
    expect(columns).toEqual([
      { name: "events.data", type: "text", compression: "l" },
      { name: "programs.check", type: "text", compression: "l" },
    ]);
    await connection.execute(`delete from shops where id = 'shp_text'`);
  });
});
