import { Migration } from "@mikro-orm/migrations";

/**
 * One pair of axis names everywhere: a layout rectangle's extents are `length` (along x, the
 * sheet's length) and `width` (along y, toward the backgauge), as the sheet's own are, where they
 * were `width` and `height`; a plan strip's `height` is its `width`. Stored checks, plan results,
 * event bodies and idempotent replies are rewritten so what is read back, resent or replayed has
 * the names the API documents. A rectangle is an object with `kind`, `group`, `stroke`, `x` and
 * `y`; a strip one with `y`, `repeat` and `pieces`.
 */
const TABLES = [
  { table: "programs", column: "check" },
  { table: "plans", column: "result" },
  { table: "events", column: "data" },
  { table: "idempotency_records", column: "response_body" },
] as const;

/** SQL true when the object `doc` has every one of `keys` (and none of `without`). */
function has(keys: string[], without: string[] = []): string {
  return [...keys.map((key) => `doc->'${key}' is not null`), ...without.map((key) => `doc->'${key}' is null`)].join(
    " and ",
  );
}

/** A function that renames the axes throughout one JSON document, in either direction. */
function axisFunctionSql(name: string, direction: "up" | "down"): string {
  const placed = ["kind", "group", "stroke", "x", "y"];
  const rectangle =
    direction === "up"
      ? `${has([...placed, "width", "height"])} then
      doc := (doc - 'width' - 'height') || jsonb_build_object('length', doc->'width', 'width', doc->'height');`
      : `${has([...placed, "length", "width"], ["height"])} then
      doc := (doc - 'length' - 'width') || jsonb_build_object('width', doc->'length', 'height', doc->'width');`;
  const strip =
    direction === "up"
      ? `${has(["y", "height", "repeat", "pieces"])} then
      doc := (doc - 'height') || jsonb_build_object('width', doc->'height');`
      : `${has(["y", "width", "repeat", "pieces"])} then
      doc := (doc - 'width') || jsonb_build_object('height', doc->'width');`;
  return `create or replace function ${name}(doc jsonb) returns jsonb language plpgsql immutable as $fn$
declare result jsonb;
begin
  if jsonb_typeof(doc) = 'object' then
    if ${rectangle}
    elsif ${strip}
    end if;
    select coalesce(jsonb_object_agg(key, ${name}(value)), '{}'::jsonb) into result from jsonb_each(doc);
    return result;
  elsif jsonb_typeof(doc) = 'array' then
    select coalesce(jsonb_agg(${name}(value) order by position), '[]'::jsonb) into result
      from jsonb_array_elements(doc) with ordinality as element(value, position);
    return result;
  end if;
  return doc;
end
$fn$;`;
}

const FUNCTION = "shearwire_axis_names";

export class Migration20261203080000_axis_names extends Migration {
  private rename(direction: "up" | "down"): void {
    this.addSql(axisFunctionSql(FUNCTION, direction));
    for (const { table, column } of TABLES) {
      this.addSql(
        `update "${table}" set "${column}" = ${FUNCTION}("${column}") where "${column}"::text like '%"${direction === "up" ? "height" : "width"}"%';`,
      );
    }
    this.addSql(`drop function ${FUNCTION}(jsonb);`);
  }

  override async up(): Promise<void> {
    this.rename("up");
  }

  override async down(): Promise<void> {
    this.rename("down");
  }
}
