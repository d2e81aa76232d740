import { Migration } from "@mikro-orm/migrations";

export class Migration20261201234604_initial extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "idempotency_records" ("key_id" varchar(255) not null, "idempotency_key" varchar(255) not null, "method" varchar(255) not null, "path" varchar(255) not null, "fingerprint" varchar(255) not null, "response_status" int null, "response_body" jsonb null, "response_headers" jsonb null, "created_at" timestamptz not null, "expires_at" timestamptz not null, constraint "idempotency_records_pkey" primary key ("key_id", "idempotency_key"));`,
    );
    this.addSql(`create index "idempotency_records_expires_at_index" on "idempotency_records" ("expires_at");`);

    this.addSql(
      `create table "request_logs" ("id" varchar(255) not null, "shop_id" varchar(255) null, "key_id" varchar(255) null, "method" varchar(255) not null, "route" varchar(255) not null, "path" varchar(255) not null, "status" int not null, "latency_ms" double precision not null, "idempotency_key" varchar(255) null, "error_type" varchar(255) null, "created_at" timestamptz not null, constraint "request_logs_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "request_logs_shop_id_created_at_index" on "request_logs" ("shop_id", "created_at");`);

    this.addSql(
      `create table "shops" ("id" varchar(255) not null, "name" varchar(255) not null, "slug" varchar(255) not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "shops_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "shops" add constraint "shops_slug_unique" unique ("slug");`);

    this.addSql(
      `create table "shears" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "name" varchar(255) not null, "description" text null, "rated_thickness_mm" double precision not null, "rated_tensile_mpa" double precision not null, "rated_rake_deg" double precision not null, "blade_length_mm" double precision not null, "backgauge_min_mm" double precision not null, "backgauge_max_mm" double precision not null, "rake_min_deg" double precision not null, "rake_max_deg" double precision not null, "gap_min_mm" double precision not null, "gap_max_mm" double precision not null, "strokes_per_min" double precision not null, "backgauge_speed_mm_per_s" double precision not null, "handling_seconds_per_turn" double precision not null, "handling_seconds_per_sheet" double precision not null, "max_blade_hardness_hb" double precision null, "grade_thickness_limits_mm" jsonb not null default '{}', "crown_at_rated_mm" double precision null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "shears_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "shears" add constraint "shears_shop_id_name_unique" unique ("shop_id", "name");`);

    this.addSql(
      `create table "grades" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "code" varchar(255) not null, "name" varchar(255) not null, "family" text check ("family" in ('carbon-steel', 'hsla-steel', 'stainless', 'aluminium', 'copper', 'abrasion-resistant')) not null, "standard" varchar(255) not null, "yield_mpa" double precision null, "tensile_min_mpa" double precision null, "tensile_typical_mpa" double precision null, "tensile_max_mpa" double precision null, "values_are_typical" boolean not null default false, "shear_tensile_ratio" double precision not null, "gauge_family" text check ("gauge_family" in ('msg', 'galvanized', 'ussg', 'awg')) null, "hardness_hb" double precision null, "note" text null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "grades_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "grades" add constraint "grades_shop_id_code_unique" unique ("shop_id", "code");`);

    this.addSql(
      `create table "api_keys" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "name" varchar(255) not null, "prefix" varchar(255) not null, "hash" varchar(255) not null, "scopes" jsonb not null, "shear_ids" jsonb not null default '[]', "expires_at" timestamptz null, "revoked_at" timestamptz null, "last_used_at" timestamptz null, "created_by" varchar(255) null, "created_at" timestamptz not null, constraint "api_keys_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "api_keys" add constraint "api_keys_hash_unique" unique ("hash");`);

    this.addSql(
      `create table "users" ("id" varchar(255) not null, "email" varchar(255) not null, "name" varchar(255) not null, "password_hash" varchar(255) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "users_pkey" primary key ("id"));`,
    );
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(
      `create table "memberships" ("id" varchar(255) not null, "user_id" varchar(255) not null, "shop_id" varchar(255) not null, "role" text check ("role" in ('owner', 'admin', 'developer', 'viewer')) not null, "created_at" timestamptz not null, constraint "memberships_pkey" primary key ("id"));`,
    );
    this.addSql(
      `alter table "memberships" add constraint "memberships_user_id_shop_id_unique" unique ("user_id", "shop_id");`,
    );

    this.addSql(
      `alter table "shears" add constraint "shears_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "grades" add constraint "grades_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "api_keys" add constraint "api_keys_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(
      `alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "memberships" add constraint "memberships_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shears" drop constraint "shears_shop_id_foreign";`);

    this.addSql(`alter table "grades" drop constraint "grades_shop_id_foreign";`);

    this.addSql(`alter table "api_keys" drop constraint "api_keys_shop_id_foreign";`);

    this.addSql(`alter table "memberships" drop constraint "memberships_shop_id_foreign";`);

    this.addSql(`alter table "memberships" drop constraint "memberships_user_id_foreign";`);

    this.addSql(`drop table if exists "idempotency_records" cascade;`);

    this.addSql(`drop table if exists "request_logs" cascade;`);

    this.addSql(`drop table if exists "shops" cascade;`);

    this.addSql(`drop table if exists "shears" cascade;`);

    this.addSql(`drop table if exists "grades" cascade;`);

    this.addSql(`drop table if exists "api_keys" cascade;`);

    this.addSql(`drop table if exists "users" cascade;`);

    this.addSql(`drop table if exists "memberships" cascade;`);
  }
}
