import { Migration } from "@mikro-orm/migrations";

export class Migration20261203081306_typed_columns extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "programs" alter column "validation" type text using ("validation"::text);`);
    this.addSql(
      `alter table "programs" add constraint "programs_validation_check" check("validation" in ('pass', 'warn', 'fail'));`,
    );

    this.addSql(`alter table "plans" alter column "status" type text using ("status"::text);`);
    this.addSql(
      `alter table "plans" add constraint "plans_status_check" check("status" in ('queued', 'running', 'complete', 'failed', 'cancelled'));`,
    );

    this.addSql(`alter table "events" alter column "type" type text using ("type"::text);`);
    this.addSql(
      `alter table "events" add constraint "events_type_check" check("type" in ('program.created', 'program.updated', 'program.released', 'program.claimed', 'program.started', 'program.progressed', 'program.completed', 'program.failed', 'program.cancelled', 'program.lease_expired', 'plan.completed', 'plan.failed', 'plan.cancelled', 'stock.created', 'stock.adjusted', 'stock.archived', 'stock.reserved', 'stock.released', 'stock.consumed', 'stock.remnant_added', 'endpoint.test'));`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "events" drop constraint if exists "events_type_check";`);

    this.addSql(`alter table "plans" drop constraint if exists "plans_status_check";`);

    this.addSql(`alter table "programs" drop constraint if exists "programs_validation_check";`);

    this.addSql(`alter table "events" alter column "type" type varchar(255) using ("type"::varchar(255));`);

    this.addSql(`alter table "plans" alter column "status" type varchar(255) using ("status"::varchar(255));`);

    this.addSql(
      `alter table "programs" alter column "validation" type varchar(255) using ("validation"::varchar(255));`,
    );
  }
}
