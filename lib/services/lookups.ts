/**
 * The reads every create and check makes (a shear by id, a grade by code, whether a reference
 * is taken), shared by the requests that arrive together: one query answers all of them
 * (lib/db/batched-lookup.ts), never a cache, so each answer is read after its request
 * arrived. Inside a transaction they read through the transaction instead.
 */
import { ReferenceKind } from "@mikro-orm/core";
import type { EntityManager } from "@mikro-orm/postgresql";
import { Grade, Program, Shear } from "../../entities";
import { batchedLookup } from "../db/batched-lookup";
import { runPrepared } from "../db/prepared";
import type { GradeRecord, ShearRecord } from "./catalog";
import { readsOf } from "../db/reads";

const SHEAR_ID = /^shr_[0-9A-Z]{26}$/;
const SEP = "\u0000";
const pairs = (keys: string[]) => keys.map((k) => k.split(SEP) as [string, string]);

type Lookup<V> = (key: string) => Promise<V | undefined>;
interface Lookups {
  shear: Lookup<ShearRecord>;
  grade: Lookup<GradeRecord>;
  reference: Lookup<string>;
}
const shared = new WeakMap<object, Lookups>();

/** `(shop_id, <column>)` among the keys' pairs, as two parallel arrays (one statement text for any number of keys). */
const byShopAnd = (column: string) => `(shop_id, ${column}) in (select * from unnest($1::text[], $2::text[]))`;
const keyArrays = (keys: string[]) => {
  const ps = pairs(keys);
  return [ps.map((p) => p[0]), ps.map((p) => p[1])];
};

/**
 * A row of an entity's table as a plain record of its own (scalar) fields, named as the entity
 * names them. node-postgres has already typed the values (numbers, parsed JSON) except
 * timestamps, which become dates here, so this is little more than renaming: turning each row
 * into a managed entity (MikroORM's `map`, which merges it into an identity map) cost ~60 µs a
 * row, more than the rest of a validation's lookups.
 */
function recordReader<T>(
  em: EntityManager,
  entityName: string,
): { columns: string; read: (row: Record<string, unknown>) => T } {
  const platform = em.getPlatform();
  const fields = em
    .getMetadata()
    .get(entityName)
    .props.filter((prop) => prop.kind === ReferenceKind.SCALAR && prop.persist !== false)
    .map((prop) => ({ name: prop.name, column: prop.fieldNames[0], date: prop.runtimeType === "Date" }));
  // named columns, not `*`: a prepared statement's result may not change shape when a column is added meanwhile
  const columns = [...new Set(["shop_id", ...fields.map((field) => field.column)])].map((c) => `"${c}"`).join(", ");
  const read = (row: Record<string, unknown>) => {
    const record: Record<string, unknown> = {};
    for (const { name, column, date } of fields) {
      const value = row[column];
      // MikroORM has node-postgres leave timestamps as text, and parses them itself
      record[name] = date && value != null ? platform.parseDate(value as string) : value;
    }
    return record as T;
  };
  return { columns, read };
}

/**
 * The shared lookups of this database connection. Each is one indexed query, a named prepared
 * statement with the keys as bound arrays (no query building per call); shears and grades are
 * read as plain records, not entities.
 */
function lookups(em: EntityManager): Lookups {
  const connection = em.getConnection();
  let readers = shared.get(connection);
  if (readers) return readers;
  const knex = connection.getKnex();
  const rows = (name: string, sql: string, keys: string[]) => runPrepared(knex, name, sql, keyArrays(keys));
  const shearOf = recordReader<ShearRecord>(em, Shear.meta.className);
  const gradeOf = recordReader<GradeRecord>(em, Grade.meta.className);
  readers = {
    shear: batchedLookup(async (keys) => {
      const found = await rows("lookup-shears", `select ${shearOf.columns} from shears where ${byShopAnd("id")}`, keys);
      return new Map(found.map((row) => [`${row.shop_id as string}${SEP}${row.id as string}`, shearOf.read(row)]));
    }),
    grade: batchedLookup(async (keys) => {
      const sql = `select ${gradeOf.columns} from grades where archived_at is null and ${byShopAnd("code")}`;
      const found = await rows("lookup-grades", sql, keys);
      return new Map(found.map((row) => [`${row.shop_id as string}${SEP}${row.code as string}`, gradeOf.read(row)]));
    }),
    reference: batchedLookup(async (keys) => {
      const sql = `select id, shop_id, reference from programs where ${byShopAnd("reference")}`;
      const found = await rows("lookup-references", sql, keys);
      return new Map(found.map((p) => [`${p.shop_id as string}${SEP}${p.reference as string}`, p.id as string]));
    }),
  };
  shared.set(connection, readers);
  return readers;
}

async function each<V>(lookup: Lookup<V>, shopId: string, keys: string[]): Promise<Map<string, V>> {
  const unique = [...new Set(keys)];
  const values = await Promise.all(unique.map((k) => lookup(`${shopId}${SEP}${k}`)));
  return new Map(unique.flatMap((k, i) => (values[i] === undefined ? [] : [[k, values[i]] as const])));
}

/** The shears these keys name, by id (archived ones too, to say so) or by name in any case (in use only). */
export async function shearsNamed(em: EntityManager, shopId: string, keys: string[]) {
  const ids = [...new Set(keys.filter((k) => SHEAR_ID.test(k)))];
  const byName = keys.some((k) => !SHEAR_ID.test(k));
  const [withIds, inUse] = await readsOf(
    em,
    async () =>
      !ids.length
        ? new Map<string, ShearRecord>()
        : em.isInTransaction()
          ? em.find(Shear, { id: { $in: ids }, shop: shopId }).then((f) => new Map(f.map((s) => [s.id, s])))
          : each(lookups(em).shear, shopId, ids),
    async () => (byName ? em.find(Shear, { shop: shopId, archivedAt: null }) : []),
  );
  const found = new Map<string, ShearRecord>(withIds);
  for (const s of inUse) found.set(s.name.trim().toLowerCase(), s);
  return (key: string) => found.get(SHEAR_ID.test(key) ? key : key.toLowerCase()) ?? null;
}

/** The shop's grades in use with these codes: code → grade. */
export async function gradesByCode(em: EntityManager, shopId: string, codes: string[]) {
  if (!em.isInTransaction()) return each(lookups(em).grade, shopId, codes);
  const found = await em.find(Grade, { shop: shopId, code: { $in: [...new Set(codes)] }, archivedAt: null });
  return new Map(found.map((g) => [g.code, g]));
}

/** Existing programs of this shop with any of these references: reference → id. */
export async function existingReferences(em: EntityManager, shopId: string, references: string[]) {
  if (!references.length) return new Map<string, string>();
  if (!em.isInTransaction()) return each(lookups(em).reference, shopId, references);
  const rows = await em.find(
    Program,
    { shop: shopId, reference: { $in: [...new Set(references)] } },
    { fields: ["id", "reference"], disableIdentityMap: true },
  );
  return new Map(rows.map((r) => [r.reference, r.id]));
}
