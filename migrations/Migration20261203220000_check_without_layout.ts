import { Migration } from "@mikro-orm/migrations";

/**
 * A program's check no longer carries the sheet's layout (it is `GET /programs/{id}/layout`, placed
 * when it is read): stored checks, event bodies and idempotent replies lose their `layout`, so what
 * is read back, resent or replayed is what the API documents now. Only a check's own `layout` goes:
 * an object with a `validation` string, a `findings` array and a `layout` object or null (a client's
 * metadata holds strings only, so a key of that name there stays). Key order is kept (json, not jsonb,
 * where the column is json). Down restores nothing: the layout is placed from the program at will.
 * Each table is rewritten in one statement, holding its rows until the migration commits: on a large
 * deployment, run it at a quiet time, and restart the workers after it (they keep up to a few thousand event
 * bodies in memory, which would still go out with their layout).
 */
const TABLES = [
  { table: "programs", column: "check", type: "json" },
  { table: "events", column: "data", type: "json" },
  { table: "idempotency_records", column: "response_body", type: "jsonb" },
] as const;

const FUNCTION = "shearwire_check_without_layout";

const FUNCTION_SQL = `create or replace function ${FUNCTION}(doc json) returns json language plpgsql immutable as $fn$
declare
  result json;
  is_check boolean;
begin
  if json_typeof(doc) = 'object' then
    is_check := coalesce(json_typeof(doc->'validation') = 'string' and json_typeof(doc->'findings') = 'array'
      and json_typeof(doc->'layout') in ('object', 'null'), false);
    select coalesce(json_object_agg(member.key, ${FUNCTION}(member.value) order by member.position), '{}'::json)
      into result
      from json_each(doc) with ordinality as member(key, value, position)
      where not (is_check and member.key = 'layout');
    return result;
  elsif json_typeof(doc) = 'array' then
    select coalesce(json_agg(${FUNCTION}(element.value) order by element.position), '[]'::json) into result
      from json_array_elements(doc) with ordinality as element(value, position);
    return result;
  end if;
  return doc;
end
$fn$;`;

export class Migration20261203220000_check_without_layout extends Migration {
  override async up(): Promise<void> {
    this.addSql(FUNCTION_SQL);
    for (const { table, column, type } of TABLES) {
      this.addSql(
        `update "${table}" set "${column}" = ${FUNCTION}("${column}"::json)::${type} where "${column}"::text like '%"layout"%';`,
      );
    }
    this.addSql(`drop function ${FUNCTION}(json);`);
  }

  override async down(): Promise<void> {
    // Nothing to restore: a program's layout is placed from the program when it is read.
  }
}
