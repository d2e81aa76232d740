import { Migration } from "@mikro-orm/migrations";

export class Migration20261203063000_stock extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `create table "stock_items" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "kind" text check ("kind" in ('sheet', 'remnant')) not null, "grade_code" text not null, "thickness_mm" double precision not null, "length_mm" double precision not null, "width_mm" double precision not null, "quantity" int not null, "reserved" int not null default 0, "location" text null, "note" text null, "source_program" varchar(255) null, "source_run" text null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "stock_items_pkey" primary key ("id"), constraint stock_items_reserved_check check (reserved >= 0 and reserved <= quantity));`,
    );
    this.addSql(`create index "stock_items_shop_id_id_index" on "stock_items" ("shop_id", "id");`);
    this.addSql(
      `create index "stock_items_shop_id_grade_code_thickness_mm_index" on "stock_items" ("shop_id", "grade_code", "thickness_mm");`,
    );
    this.addSql(
      `create table "stock_reservations" ("id" varchar(255) not null, "shop_id" varchar(255) not null, "item_id" varchar(255) not null, "quantity" int not null, "status" text check ("status" in ('open', 'consumed', 'released')) not null default 'open', "program" varchar(255) null, "note" text null, "created_at" timestamptz not null, "closed_at" timestamptz null, constraint "stock_reservations_pkey" primary key ("id"));`,
    );
    this.addSql(`create index "stock_reservations_shop_id_id_index" on "stock_reservations" ("shop_id", "id");`);
    this.addSql(
      `create index "stock_reservations_program_status_index" on "stock_reservations" ("program", "status");`,
    );
    this.addSql(
      `alter table "stock_items" add constraint "stock_items_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "stock_reservations" add constraint "stock_reservations_shop_id_foreign" foreign key ("shop_id") references "shops" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "stock_reservations" add constraint "stock_reservations_item_id_foreign" foreign key ("item_id") references "stock_items" ("id") on update cascade on delete restrict;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "stock_reservations" cascade;`);
    this.addSql(`drop table if exists "stock_items" cascade;`);
  }
}
