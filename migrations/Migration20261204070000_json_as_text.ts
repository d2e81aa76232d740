import { Migration } from "@mikro-orm/migrations";

/**
 * A program's check and every event's body are kept as `text` holding JSON, not `json`. Both are
 * written once by `JSON.stringify` and read whole; nothing queries inside them. `json` only checked
 * the text again on each insert: for a batch of 100 programs (each check ~3.4 kB and its event
 * ~4.1 kB) that was ~2.5 ms of the database's ~13 ms in isolation. Reading them is unchanged (the
 * application parses them, as node-postgres did for `json`), and the worker now builds a webhook's
 * body around the stored text instead of parsing it and writing it out again. They keep lz4 (a
 * change of type resets a column's compression, so it is set again). The type change rewrites
 * both tables: on a large database, run it in a quiet hour.
 */
export class Migration20261204070000_json_as_text extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "programs" alter column "check" type text using "check"::text;`);
    this.addSql(`alter table "programs" alter column "check" set compression lz4;`);
    this.addSql(`alter table "events" alter column "data" type text using "data"::text;`);
    this.addSql(`alter table "events" alter column "data" set compression lz4;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "programs" alter column "check" type json using "check"::json;`);
    this.addSql(`alter table "programs" alter column "check" set compression lz4;`);
    this.addSql(`alter table "events" alter column "data" type json using "data"::json;`);
    this.addSql(`alter table "events" alter column "data" set compression lz4;`);
  }
}
