import { Migration } from '@mikro-orm/migrations';

export class Migration20261201234041_initial extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "shops" ("id" varchar(255) not null, "name" varchar(255) not null, "slug" varchar(255) not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "shops_pkey" primary key ("id"));`);
    this.addSql(`alter table "shops" add constraint "shops_slug_unique" unique ("slug");`);

    this.addSql(`create table "shears" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "name" varchar(255) not null, "description" text null, "rated_thickness_mm" double precision not null, "rated_tensile_mpa" double precision not null, "rated_rake_deg" double precision not null, "blade_length_mm" double precision not null, "backgauge_min_mm" double precision not null, "backgauge_max_mm" double precision not null, "rake_min_deg" double precision not null, "rake_max_deg" double precision not null, "gap_min_mm" double precision not null, "gap_max_mm" double precision not null, "strokes_per_min" double precision not null, "backgauge_speed_mm_s" double precision not null, "handling_per_turn_s" double precision not null, "handling_per_sheet_s" double precision not null, "blade_max_hardness_hb" double precision null, "grade_limits_mm" jsonb not null default '{}', "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "shears_pkey" primary key ("id"));`);
    this.addSql(`alter table "shears" add constraint "shears_shop_id_name_unique" unique ("shop_id", "name");`);

    this.addSql(`create table "grades" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "code" varchar(255) not null, "name" varchar(255) not null, "family" text check ("family" in ('carbon-steel', 'hsla-steel', 'stainless', 'aluminium', 'copper', 'abrasion-resistant')) not null, "standard" varchar(255) not null, "yield_mpa" double precision null, "tensile_mpa" double precision not null, "tensile_typical" boolean not null default false, "shear_ratio" double precision not null, "gauge_family" text check ("gauge_family" in ('msg', 'galvanized', 'ussg', 'awg')) null, "hardness_hb" double precision null, "notes" text null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "grades_pkey" primary key ("id"));`);
    this.addSql(`alter table "grades" add constraint "grades_shop_id_code_unique" unique ("shop_id", "code");`);

    this.addSql(`create table "users" ("id" varchar(255) not null, "email" varchar(255) not null, "name" varchar(255) not null, "password_hash" varchar(255) null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "users_pkey" primary key ("id"));`);
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(`create table "memberships" ("id" varchar(255) not null, "user_id" varchar(255) not null, "shop_id" varchar(255) not null, "role" text check ("role" in ('owner', 'admin', 'developer', 'viewer')) not null, "created_at" timestamptz not null, constraint "memberships_pkey" primary key ("id"));`);
    this.addSql(`alter table "memberships" add constraint "memberships_user_id_shop_id_unique" unique ("user_id", "shop_id");`);

    this.addSql(`alter table "shears" add constraint "shears_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "grades" add constraint "grades_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "shears" drop constraint "shears_shop_id_foreign";`);

    this.addSql(`alter table "grades" drop constraint "grades_shop_id_foreign";`);

    this.addSql(`alter table "memberships" drop constraint "memberships_shop_id_foreign";`);

    this.addSql(`alter table "memberships" drop constraint "memberships_user_id_foreign";`);

    this.addSql(`drop table if exists "shops" cascade;`);

    this.addSql(`drop table if exists "shears" cascade;`);

    this.addSql(`drop table if exists "grades" cascade;`);

    this.addSql(`drop table if exists "users" cascade;`);

    this.addSql(`drop table if exists "memberships" cascade;`);
  }

}
