import { Migration } from "@mikro-orm/migrations";

/**
 * A program's check and every event's body become `json` (the text as written, checked to be JSON)
 * instead of `jsonb` (parsed into PostgreSQL's binary form). Nothing queries inside them; they are
 * written once and read whole, and turning kilobytes of numbers into jsonb's numerics and back was
 * most of the database's time per created program. They keep lz4. Objects now read back with their
 * keys in the order they were written (jsonb sorts them), as the API first answered them.
 */
export class Migration20261203110000_json_bodies extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "programs" alter column "check" type json using "check"::text::json;`);
    this.addSql(`alter table "programs" alter column "check" set compression lz4;`);
    this.addSql(`alter table "events" alter column "data" type json using "data"::text::json;`);
    this.addSql(`alter table "events" alter column "data" set compression lz4;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "programs" alter column "check" type jsonb using "check"::jsonb;`);
    this.addSql(`alter table "programs" alter column "check" set compression lz4;`);
    this.addSql(`alter table "events" alter column "data" type jsonb using "data"::jsonb;`);
    this.addSql(`alter table "events" alter column "data" set compression lz4;`);
  }
}
