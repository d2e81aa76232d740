import { Migration } from "@mikro-orm/migrations";

export class Migration20261201235446_api extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "programs" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "shear_id" varchar(255) not null, "reference" varchar(255) not null, "title" varchar(255) null, "status" text check ("status" in ('draft', 'released', 'claimed', 'running', 'completed', 'failed', 'cancelled')) not null default 'draft', "revision" int not null default 1, "input" jsonb not null, "grade_code" varchar(255) not null, "units" varchar(255) not null, "priority" int not null default 0, "due_at" timestamptz null, "validation" varchar(255) not null, "check" jsonb not null, "acknowledged" jsonb not null default '[]', "metadata" jsonb not null default '{}', "released_at" timestamptz null, "cancelled_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "programs_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "programs_shop_id_status_id_index" on "programs" ("shop_id", "status", "id");`);
    this.addSql(`create index "programs_shop_id_updated_at_id_index" on "programs" ("shop_id", "updated_at", "id");`);
    this.addSql(
      `alter table "programs" add constraint "programs_shop_id_reference_unique" unique ("shop_id", "reference");`,
    );

    this.addSql(
      `create table "events" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "type" varchar(255) not null, "subject_id" varchar(255) not null, "data" jsonb not null, "created_at" timestamptz not null, constraint "events_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "events_shop_id_id_index" on "events" ("shop_id", "id");`);
    this.addSql(`create index "events_subject_id_id_index" on "events" ("subject_id", "id");`);

    this.addSql(
      `alter table "programs" add constraint "programs_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "programs" add constraint "programs_shear_id_foreign" foreign key ("shear_id") references "shears" ("id") on update cascade on delete restrict;`,
    );

    this.addSql(
      `alter table "events" add constraint "events_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`alter table "api_keys" add column "rate_limit_per_min" int null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "programs" cascade;`);

    this.addSql(`drop table if exists "events" cascade;`);

    this.addSql(`alter table "api_keys" drop column "rate_limit_per_min";`);
  }
}
