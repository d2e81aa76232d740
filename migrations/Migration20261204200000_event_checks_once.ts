import { Migration } from "@mikro-orm/migrations";

/**
 * A created program's check is stored once. The `program.created` event's body holds the program as
 * the API showed it, check included, and the program row holds the same check: two copies of ~3.4 kB
 * (each compressed to ~2.2 kB, two TOAST chunks) for every program created. The body is now written
 * with `null` in the check's place and `check_at`, the character position of that `null`; readers put
 * the program's check there in the same statement that reads the body.
 *
 * That is right only while the program's check is the one it was created with. Before a program's
 * check changes (a release re-checks it against the catalog as it is then, an update checks the new
 * input) or the program is deleted, a trigger gives every event still borrowing it its own copy
 * (the body with the old check in place, `check_at` cleared), in the same transaction, so no event's
 * body ever changes. Bodies written before this migration, and every other event's, keep
 * `check_at` null and are read as stored. A data migration that rewrites event bodies must take the
 * borrowed ones into account (or give them their copies first, as `down` does).
 */
export class Migration20261204200000_event_checks_once extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "events" add column "check_at" int null;`);
    this.addSql(`create or replace function shearwire_events_keep_check() returns trigger language plpgsql as $fn$
begin
  update events set data = overlay(data placing old."check" from check_at for 4), check_at = null
    where subject_id = old.id and check_at is not null;
  if tg_op = 'DELETE' then return old; end if;
  return new;
end $fn$;`);
    this.addSql(`create trigger programs_keep_event_checks before update of "check" on programs for each row
  when (old."check" is distinct from new."check") execute function shearwire_events_keep_check();`);
    this.addSql(`create trigger programs_keep_event_checks_on_delete before delete on programs for each row
  execute function shearwire_events_keep_check();`);
  }

  override async down(): Promise<void> {
    this.addSql(`update events e set data = overlay(e.data placing p."check" from e.check_at for 4), check_at = null
  from programs p where p.id = e.subject_id and e.check_at is not null;`);
    this.addSql(`drop trigger programs_keep_event_checks_on_delete on programs;`);
    this.addSql(`drop trigger programs_keep_event_checks on programs;`);
    this.addSql(`drop function shearwire_events_keep_check();`);
    this.addSql(`alter table "events" drop column "check_at";`);
  }
}
