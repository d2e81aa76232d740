import { Migration } from "@mikro-orm/migrations";

/**
 * Plans become jobs: a state (queued, running, complete, failed, cancelled), progress, a
 * failure reason, attempts and times. Plans stored before were computed on the spot: they
 * are `complete`, and their answer keeps only the planner's own fields, its completeness
 * as `coverage` (strips and pieces without runs are read as runs of one).
 */
export class Migration20261202170059_plan_jobs extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "plans" add column "progress" jsonb null, add column "failure" jsonb null, add column "attempts" int not null default 0, add column "started_at" timestamptz null, add column "finished_at" timestamptz null, add column "updated_at" timestamptz null;`,
    );
    this.addSql(`alter table "plans" alter column "result" drop not null;`);
    this.addSql(`update "plans" set
      "result" = ("result" - 'status' - 'reference' - 'title' - 'shear' - 'grade' - 'thickness' - 'units' - 'programs' - 'id' - 'createdAt') || jsonb_build_object('coverage', "result"->'status'),
      "status" = 'complete', "attempts" = 1, "started_at" = "created_at", "finished_at" = "created_at";`);
    this.addSql(`update "plans" set "updated_at" = "created_at";`);
    this.addSql(`alter table "plans" alter column "updated_at" set not null;`);
    this.addSql(`create index "plans_status_updated_at_index" on "plans" ("status", "updated_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop index "plans_status_updated_at_index";`);
    this.addSql(`delete from "plans" where "result" is null;`);
    this.addSql(`update "plans" set "status" = "result"->>'coverage';`);
    this.addSql(
      `alter table "plans" drop column "progress", drop column "failure", drop column "attempts", drop column "started_at", drop column "finished_at", drop column "updated_at";`,
    );
    this.addSql(`alter table "plans" alter column "result" set not null;`);
  }
}
