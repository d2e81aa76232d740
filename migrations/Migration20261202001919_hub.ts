import { Migration } from "@mikro-orm/migrations";

export class Migration20261202001919_hub extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "webhook_endpoints" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "url" text not null, "description" varchar(255) null, "event_types" jsonb not null default '[]', "enabled" boolean not null default true, "disabled_reason" varchar(255) null, "secret" varchar(255) not null, "previous_secret" varchar(255) null, "previous_secret_expires_at" timestamptz null, "consecutive_failures" int not null default 0, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "webhook_endpoints_pkey" primary key ("id"));`,
    );

    this.addSql(
      `create table "deliveries" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "event_id" varchar(255) not null, "endpoint_id" varchar(255) not null, "status" text check ("status" in ('pending', 'succeeded', 'failed', 'skipped')) not null default 'pending', "attempts" int not null default 0, "next_attempt_at" timestamptz null, "last_status_code" int null, "last_error" text null, "manual" boolean not null default false, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "deliveries_pkey" primary key ("id"));`,
    );
    this.addSql(
      `create index "deliveries_status_next_attempt_at_index" on "deliveries" ("status", "next_attempt_at");`,
    );
    this.addSql(`create index "deliveries_endpoint_id_id_index" on "deliveries" ("endpoint_id", "id");`);
    this.addSql(`create index "deliveries_event_id_id_index" on "deliveries" ("event_id", "id");`);

    this.addSql(
      `create table "delivery_attempts" ("id" varchar(255) not null, "delivery_id" varchar(255) not null, "attempted_at" timestamptz not null, "status_code" int null, "latency_ms" double precision not null, "response_excerpt" text null, "error" text null, constraint "delivery_attempts_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "delivery_attempts_delivery_id_id_index" on "delivery_attempts" ("delivery_id", "id");`);

    this.addSql(
      `alter table "webhook_endpoints" add constraint "webhook_endpoints_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "deliveries" add constraint "deliveries_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "deliveries" add constraint "deliveries_event_id_foreign" foreign key ("event_id") references "events" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "deliveries" add constraint "deliveries_endpoint_id_foreign" foreign key ("endpoint_id") references "webhook_endpoints" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "delivery_attempts" add constraint "delivery_attempts_delivery_id_foreign" foreign key ("delivery_id") references "deliveries" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "programs" add column "claimed_by" varchar(255) null, add column "lease_expires_at" timestamptz null, add column "lease_expiries" int not null default 0, add column "claimed_at" timestamptz null, add column "started_at" timestamptz null, add column "finished_at" timestamptz null, add column "progress" jsonb null, add column "outcome" jsonb null;`,
    );
    this.addSql(
      `create index "programs_shear_id_status_priority_due_at_index" on "programs" ("shear_id", "status", "priority", "due_at");`,
    );
    this.addSql(`create index "programs_status_lease_expires_at_index" on "programs" ("status", "lease_expires_at");`);

    this.addSql(`alter table "events" add column "dispatched_at" timestamptz null;`);
    this.addSql(`create index "events_dispatched_at_index" on "events" ("dispatched_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "deliveries" drop constraint "deliveries_endpoint_id_foreign";`);

    this.addSql(`alter table "delivery_attempts" drop constraint "delivery_attempts_delivery_id_foreign";`);

    this.addSql(`drop table if exists "webhook_endpoints" cascade;`);

    this.addSql(`drop table if exists "deliveries" cascade;`);

    this.addSql(`drop table if exists "delivery_attempts" cascade;`);

    this.addSql(`drop index "events_dispatched_at_index";`);
    this.addSql(`alter table "events" drop column "dispatched_at";`);

    this.addSql(`drop index "programs_shear_id_status_priority_due_at_index";`);
    this.addSql(`drop index "programs_status_lease_expires_at_index";`);
    this.addSql(
      `alter table "programs" drop column "claimed_by", drop column "lease_expires_at", drop column "lease_expiries", drop column "claimed_at", drop column "started_at", drop column "finished_at", drop column "progress", drop column "outcome";`,
    );
  }
}
